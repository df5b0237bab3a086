using RunWatch.Wafers.Intake;
using Xunit;

namespace RunWatch.Wafers.Tests.Intake;

public sealed class IntakeOptionsTests
{
    [Fact]
    public void Validate_Defaults_Valid() => Assert.Empty(new IntakeOptions().Validate());

    [Fact]
    public void Validate_BadValues_EachReported()
    {
        var options = new IntakeOptions { DropFolder = " ", FileNamePattern = "W-[0-9]+", RescanInterval = TimeSpan.Zero, StableFor = TimeSpan.Zero };
        var problems = options.Validate();
        Assert.Equal(4, problems.Count);
        Assert.Contains(problems, p => p.Contains("named group 'wafer'", StringComparison.Ordinal));
    }
}
