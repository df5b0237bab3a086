using System.ComponentModel.DataAnnotations;
using RunWatch.Core.Excursions;
using RunWatch.Core.Thermal;

namespace RunWatch.Ingest.Configuration;

/// <summary>A chamber, one item of the <c>Chambers</c> list (config/chambers.json or appsettings).</summary>
public sealed class ChamberOptions
{
    /// <summary>Chamber name, the third topic level.</summary>
    [Required]
    [RegularExpression("^[^/#+]+$")]
    public string Name { get; set; } = "";

    /// <summary>Site, the second topic level.</summary>
    [Required]
    [RegularExpression("^[^/#+]+$")]
    public string Site { get; set; } = "";

    /// <summary>Free text.</summary>
    public string? Description { get; set; }

    /// <summary>Channels.</summary>
    public List<ChannelOptions> Channels { get; set; } = [];

    /// <summary>Run detection.</summary>
    public RunDetectionOptions Runs { get; set; } = new();

    /// <summary>Process parameters for the thermal figures.</summary>
    public ProcessOptions Process { get; set; } = new();

    /// <summary>How L_eff is computed at run end (convention factor c, gap limit).</summary>
    public DiffusionLengthOptions DiffusionLength { get; set; } = new();

    /// <summary>Live excursion alarms on the growth temperature (bands around the setpoint, limits, rate, stale, flatline).</summary>
    public ExcursionOptions Excursions { get; set; } = new();
}
