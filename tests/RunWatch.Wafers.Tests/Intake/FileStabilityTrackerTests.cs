using RunWatch.Wafers.Intake;
using Xunit;

namespace RunWatch.Wafers.Tests.Intake;

public sealed class FileStabilityTrackerTests
{
    private static readonly DateTimeOffset T0 = new(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);

    [Fact]
    public void Observe_GrowingFile_NotStableUntilUnchangedLongEnough()
    {
        var tracker = new FileStabilityTracker(TimeSpan.FromSeconds(2));
        Assert.False(tracker.Observe("a.png", 100, T0, T0));
        Assert.False(tracker.Observe("a.png", 200, T0.AddSeconds(1), T0.AddSeconds(1)));
        Assert.False(tracker.Observe("a.png", 200, T0.AddSeconds(1), T0.AddSeconds(2)));
        Assert.True(tracker.Observe("a.png", 200, T0.AddSeconds(1), T0.AddSeconds(3)));
        Assert.False(tracker.Observe("a.png", 200, T0.AddSeconds(1), T0.AddSeconds(10)));
        Assert.Equal(0, tracker.Pending);
    }

    [Fact]
    public void Observe_FileChangedAfterStable_ReportedAgainOnceStable()
    {
        var tracker = new FileStabilityTracker(TimeSpan.FromSeconds(1));
        tracker.Observe("a.png", 10, T0, T0);
        Assert.True(tracker.Observe("a.png", 10, T0, T0.AddSeconds(1)));
        Assert.False(tracker.Observe("a.png", 20, T0.AddSeconds(5), T0.AddSeconds(5)));
        Assert.Equal(1, tracker.Pending);
        Assert.True(tracker.Observe("a.png", 20, T0.AddSeconds(5), T0.AddSeconds(6)));
    }

    [Fact]
    public void Observe_EmptyFile_StableOnceSoTheScannerRefusesIt()
    {
        // An empty file (or a FIFO, which reports length 0) used to be watched for ever, never reported.
        var tracker = new FileStabilityTracker(TimeSpan.FromSeconds(1));
        tracker.Observe("a.png", 0, T0, T0);
        Assert.True(tracker.Observe("a.png", 0, T0, T0.AddSeconds(5)));
        Assert.False(tracker.Observe("a.png", 0, T0, T0.AddSeconds(9)));
        Assert.Equal(0, tracker.Pending);
    }
}
