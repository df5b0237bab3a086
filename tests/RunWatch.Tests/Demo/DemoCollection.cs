using Xunit;

namespace RunWatch.Tests.Demo;

/// <summary>Test classes that share one running <c>runwatch demo</c> (it takes about two minutes to play).</summary>
[CollectionDefinition(Name)]
public sealed class DemoCollection : ICollectionFixture<DemoFixture>
{
    public const string Name = "runwatch demo";
}
