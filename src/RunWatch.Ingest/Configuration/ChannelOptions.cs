using System.ComponentModel.DataAnnotations;
using RunWatch.Storage;

namespace RunWatch.Ingest.Configuration;

/// <summary>One channel of a chamber.</summary>
public sealed class ChannelOptions
{
    /// <summary>Name as published in telemetry.</summary>
    [Required]
    public string Name { get; set; } = "";

    /// <summary>Role. <value>Default <see cref="ChannelRole.Other"/>.</value></summary>
    public ChannelRole Role { get; set; } = ChannelRole.Other;

    /// <summary>Unit of the published value, e.g. <c>degC</c>.</summary>
    [Required]
    public string Unit { get; set; } = "";

    /// <summary>Lowest physically possible reading, or null.</summary>
    public double? Min { get; set; }

    /// <summary>Highest physically possible reading, or null.</summary>
    public double? Max { get; set; }

    /// <summary>Piecewise-linear calibration points (reading → true), sorted by reading.</summary>
    public List<CalibrationPointOptions> Calibration { get; set; } = [];
}
