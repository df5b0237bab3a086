using System.ComponentModel.DataAnnotations;

namespace RunWatch.Ingest.Configuration;

/// <summary>Ingest pipeline, bound from the <c>Ingest</c> section.</summary>
public sealed class IngestOptions
{
    /// <summary>Configuration section name.</summary>
    public const string SectionName = "Ingest";

    /// <summary>First topic level. <value>Default <c>runwatch</c>.</value></summary>
    [Required]
    [RegularExpression("^[^/#+]+$")]
    public string TopicRoot { get; set; } = "runwatch";

    /// <summary>Messages the MQTT callback may queue for the committer before it waits. <value>Default 8192.</value></summary>
    [Range(1, 1_000_000)]
    public int QueueCapacity { get; set; } = 8192;

    /// <summary>Most messages committed in one transaction; keep at or below the broker's in-flight limit. <value>Default 1000.</value></summary>
    [Range(1, 65535)]
    public int MaxBatchMessages { get; set; } = 1000;

    /// <summary>Longest a received message waits for its batch to commit. <value>Default 100 ms.</value></summary>
    public TimeSpan MaxBatchDelay { get; set; } = TimeSpan.FromMilliseconds(100);

    /// <summary>When the queue runs dry, wait this long for more before committing (groups small bursts). <value>Default 2 ms.</value></summary>
    public TimeSpan BatchLinger { get; set; } = TimeSpan.FromMilliseconds(2);

    /// <summary>Largest payload accepted, bytes; larger ones are rejected as oversize. <value>Default 256 KiB.</value></summary>
    [Range(16, 268_435_455)]
    public int MaxPayloadBytes { get; set; } = 256 * 1024;

    /// <summary>Samples stamped further in the future than this are rejected. <value>Default 5 min.</value></summary>
    public TimeSpan MaxFutureSkew { get; set; } = TimeSpan.FromMinutes(5);

    /// <summary>Samples older than this are rejected. <value>Default 30 days.</value></summary>
    public TimeSpan MaxSampleAge { get; set; } = TimeSpan.FromDays(30);

    /// <summary>At most one log line per reject reason per this interval (the rest are counted). <value>Default 10 s.</value></summary>
    public TimeSpan RejectLogInterval { get; set; } = TimeSpan.FromSeconds(10);

    /// <summary>Include payloads in reject log lines. <value>Default false.</value></summary>
    public bool LogPayloads { get; set; }

    /// <summary>First wait after a failed commit; doubles up to <see cref="CommitRetryMaxDelay"/>. <value>Default 250 ms.</value></summary>
    public TimeSpan CommitRetryInitialDelay { get; set; } = TimeSpan.FromMilliseconds(250);

    /// <summary>Longest wait between commit attempts while the store is unavailable. <value>Default 10 s.</value></summary>
    public TimeSpan CommitRetryMaxDelay { get; set; } = TimeSpan.FromSeconds(10);
}
