namespace RunWatch.Ingest.Configuration;

/// <summary>Alert thresholds of a chamber.</summary>
public sealed class ChamberAlertOptions
{
    /// <summary>Deviation of the growth temperature from the setpoint that starts an excursion, K. <value>Default 5.</value></summary>
    public double ExcursionThresholdK { get; set; } = 5.0;

    /// <summary>The deviation must fall this far below the threshold to clear (deadband), K. <value>Default 1.</value></summary>
    public double ExcursionDeadbandK { get; set; } = 1.0;

    /// <summary>An excursion must last this long before it is an alert (on-delay). <value>Default 10 s.</value></summary>
    public TimeSpan ExcursionOnDelay { get; set; } = TimeSpan.FromSeconds(10);

    /// <summary>No telemetry for this long during an open run raises a stale-telemetry alert. <value>Default 60 s.</value></summary>
    public TimeSpan StaleAfter { get; set; } = TimeSpan.FromSeconds(60);
}
