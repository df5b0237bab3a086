using System.ComponentModel.DataAnnotations;

namespace RunWatch.Ingest.Configuration;

/// <summary>How runs are found and when an unfinished one is closed.</summary>
public sealed class RunDetectionOptions
{
    /// <summary>Events or shutter. <value>Default <see cref="RunDetectionMode.Events"/>.</value></summary>
    public RunDetectionMode Mode { get; set; } = RunDetectionMode.Events;

    /// <summary>The shutter counts as open at or above this value. <value>Default 0.5.</value></summary>
    public double ShutterOpenAtOrAbove { get; set; } = 0.5;

    /// <summary>Shutter-mode runs end after the shutter stayed closed this long. <value>Default 30 s.</value></summary>
    public TimeSpan ShutterCloseDebounce { get; set; } = TimeSpan.FromSeconds(30);

    /// <summary>A run with a planned time is closed by timeout after planned × this factor + <see cref="TimeoutGrace"/>. <value>Default 2.</value></summary>
    [Range(1.0, 100.0)]
    public double PlannedTimeoutFactor { get; set; } = 2.0;

    /// <summary>Added to the planned-time rule. <value>Default 10 min.</value></summary>
    public TimeSpan TimeoutGrace { get; set; } = TimeSpan.FromMinutes(10);

    /// <summary>A run without a planned time is closed by timeout after this. <value>Default 12 h.</value></summary>
    public TimeSpan MaxRunDuration { get; set; } = TimeSpan.FromHours(12);

    /// <summary>A run with no telemetry at all for this long is closed by timeout at its last sample. <value>Default 30 min.</value></summary>
    public TimeSpan NoTelemetryTimeout { get; set; } = TimeSpan.FromMinutes(30);
}
