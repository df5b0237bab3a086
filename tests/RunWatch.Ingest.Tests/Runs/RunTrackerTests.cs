using Microsoft.Extensions.Logging.Abstractions;
using RunWatch.Ingest.Chambers;
using RunWatch.Ingest.Configuration;
using RunWatch.Ingest.Runs;
using RunWatch.Ingest.Tests.Support;
using RunWatch.Storage;

namespace RunWatch.Ingest.Tests.Runs;

public sealed class RunTrackerTests
{
    private static readonly DateTimeOffset T0 = Batches.T0;
    private readonly RecordingListener _listener = new();

    [Fact]
    public void OnCommitted_RunStartThenRunEnd_OpensThenClosesWithEndEvent()
    {
        var tracker = Tracker(RunDetectionMode.Events);

        tracker.OnCommitted(Batches.Of(), [Start("R0412", 0, planned: 1800)], T0);
        Assert.Equal("R0412", tracker.OpenRun(1)?.Name);
        tracker.OnCommitted(Batches.Of(), [Event("run-end", "R0412", 1500)], T0);

        var work = Drain(tracker);
        Assert.Equal(2, work.Count);
        Assert.False(work[0].Close);
        var closed = work[1].Run.Record;
        Assert.True(work[1].Close);
        Assert.Equal(RunStatus.Closed, closed.Status);
        Assert.Equal(RunEndReason.EndEvent, closed.EndReason);
        Assert.Equal(T0.AddSeconds(1500), closed.EndedAt);
        Assert.Equal(["W-1"], closed.Wafers);
        Assert.Equal(610, closed.SetpointC);
        Assert.Null(tracker.OpenRun(1));
        Assert.Equal(["start 1", "end 1"], _listener.Calls);
    }

    [Fact]
    public void OnCommitted_SecondRunStart_SupersedesTheOpenRun()
    {
        var tracker = Tracker(RunDetectionMode.Events);
        tracker.OnCommitted(Batches.Of(), [Start("R1", 0), Start("R2", 100)], T0);

        var work = Drain(tracker);
        Assert.Equal(RunEndReason.Superseded, work.Single(w => w.Close).Run.Record.EndReason);
        Assert.Equal("R2", tracker.OpenRun(1)?.Name);
    }

    [Fact]
    public void OnCommitted_RedeliveredRunStart_IsIgnored()
    {
        var tracker = Tracker(RunDetectionMode.Events);
        tracker.OnCommitted(Batches.Of(), [Start("R1", 0)], T0);
        tracker.OnCommitted(Batches.Of(), [Start("R1", 0)], T0);

        Assert.Single(Drain(tracker));
    }

    [Fact]
    public void OnCommitted_ShutterOpensAndStaysClosedPastDebounce_RunFromShutter()
    {
        var tracker = Tracker(RunDetectionMode.Shutter);

        tracker.OnCommitted(Batches.Of((0, 12, 0), (10, 12, 1), (20, 10, 600), (500, 12, 0), (510, 12, 1), (900, 12, 0)), [], T0);
        Assert.NotNull(tracker.OpenRun(1));
        tracker.OnCommitted(Batches.Of((931, 12, 0)), [], T0);

        var work = Drain(tracker);
        var closed = work.Single(w => w.Close).Run.Record;
        Assert.Equal(RunSource.Shutter, closed.Source);
        Assert.Equal(RunEndReason.ShutterClosed, closed.EndReason);
        Assert.Equal(T0.AddSeconds(10), closed.StartedAt);
        Assert.Equal(T0.AddSeconds(900), closed.EndedAt);
        Assert.StartsWith("C1-20260304-100010", closed.Name, StringComparison.Ordinal);
    }

    [Fact]
    public void Tick_ShutterClosedLongerThanDebounceWithoutFurtherSamples_ClosesAtTheClosing()
    {
        var tracker = Tracker(RunDetectionMode.Shutter);
        tracker.OnCommitted(Batches.Of((0, 12, 1), (60, 12, 0)), [], T0);

        tracker.Tick(T0.AddSeconds(80));
        Assert.NotNull(tracker.OpenRun(1));
        tracker.Tick(T0.AddSeconds(91));

        Assert.Equal(T0.AddSeconds(60), Drain(tracker).Single(w => w.Close).Run.Record.EndedAt);
    }

    [Fact]
    public void Tick_NoEndEventPastPlannedTimeRule_ClosedByTimeoutAndMarked()
    {
        var tracker = Tracker(RunDetectionMode.Events);
        tracker.OnCommitted(Batches.Of(), [Start("R1", 0, planned: 100)], T0);
        tracker.OnCommitted(Batches.Of((50, 10, 600), (150, 10, 600)), [], T0);

        // Rule: planned × 2 + 10 min grace = 800 s after the start.
        tracker.Tick(T0.AddSeconds(799));
        Assert.NotNull(tracker.OpenRun(1));
        tracker.Tick(T0.AddSeconds(801));

        var closed = Drain(tracker).Single(w => w.Close).Run.Record;
        Assert.Equal(RunEndReason.Timeout, closed.EndReason);
        Assert.Equal(T0.AddSeconds(150), closed.EndedAt);
        Assert.Equal(T0.AddSeconds(150), closed.LastSampleAt);
    }

    [Fact]
    public void Tick_NoTelemetryForTheTimeout_ClosesAtTheLastSample()
    {
        var tracker = Tracker(RunDetectionMode.Events);
        tracker.OnCommitted(Batches.Of(), [Start("R1", 0)], T0);
        tracker.OnCommitted(Batches.Of((30, 10, 600)), [], T0);

        tracker.Tick(T0.AddSeconds(30).AddMinutes(30).AddSeconds(1));

        var closed = Drain(tracker).Single(w => w.Close).Run.Record;
        Assert.Equal(RunEndReason.Timeout, closed.EndReason);
        Assert.Equal(T0.AddSeconds(30), closed.EndedAt);
    }

    private RunTracker Tracker(RunDetectionMode mode)
    {
        var holder = new ChamberRegistryHolder();
        holder.Set(TestChambers.Registry(TestChambers.Chamber(mode)));
        return new RunTracker(holder, [_listener], NullLogger<RunTracker>.Instance);
    }

    private static List<RunWork> Drain(RunTracker tracker)
    {
        var list = new List<RunWork>();
        while (tracker.Work.TryRead(out var work))
        {
            list.Add(work);
        }
        return list;
    }

    private static ChamberEvent Start(string run, double seconds, double? planned = null) =>
        new(1, T0.AddSeconds(seconds), "run-start", run, ["W-1"], "nw-std", 610, planned, null);

    private static ChamberEvent Event(string type, string? run, double seconds) =>
        new(1, T0.AddSeconds(seconds), type, run, [], null, null, null, null);

    private sealed class RecordingListener : IRunLifecycleListener
    {
        public List<string> Calls { get; } = [];

        public void RunStarted(long chamberId, long timestampUs, double? setpointC) => Calls.Add("start " + chamberId);

        public void RunEnded(long chamberId, long timestampUs) => Calls.Add("end " + chamberId);
    }
}
