using System.Reflection;
using Xunit.Sdk;

namespace RunWatch.Storage.Tests.Contract;

/// <summary>Runs a theory once per store implementation: the same test body against SQLite and PostgreSQL.</summary>
[AttributeUsage(AttributeTargets.Method)]
public sealed class AllStoresAttribute : DataAttribute
{
    /// <inheritdoc />
    public override IEnumerable<object[]> GetData(MethodInfo testMethod) =>
    [
        [StoreKind.Sqlite],
        [StoreKind.PostgreSql],
    ];
}
