using RunWatch.Storage;

namespace RunWatch.Ingest.Runs;

/// <summary>
/// An open run as the tracker follows it. <see cref="Record"/> is replaced (records are immutable) under the
/// tracker's lock; <see cref="Id"/> is set by the tracking service once the run is stored.
/// </summary>
internal sealed class TrackedRun(RunRecord record)
{
    private long _id = record.Id;

    public RunRecord Record { get; set; } = record;

    public long Id
    {
        get => Interlocked.Read(ref _id);
        set => Interlocked.Exchange(ref _id, value);
    }

    /// <summary>Shutter mode: when the shutter last went below the threshold (µs), or null while open.</summary>
    public long? ShutterClosedSinceUs { get; set; }
}
