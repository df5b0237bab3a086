namespace RunWatch.Ingest.Configuration;

/// <summary>A calibration point: what the channel read when the true value was <see cref="True"/>.</summary>
public sealed class CalibrationPointOptions
{
    /// <summary>Reading as published.</summary>
    public double Reading { get; set; }

    /// <summary>True value at that reading.</summary>
    public double True { get; set; }
}
