namespace RunWatch.Core.Thermal;

/// <summary>How diffusion lengths are computed. Bound from the section <c>DiffusionLength</c>.</summary>
public sealed class DiffusionLengthOptions
{
    /// <summary>
    /// The convention factor's default, and the value assumed wherever a stored figure does not record its own
    /// (defined here only).
    /// </summary>
    public const double DefaultConventionFactor = 1;

    /// <summary>The convention factor c in L = sqrt(c·∫D dt).</summary>
    /// <value>Default 1 (L = sqrt(D·t)); 4 gives the 2-D mean-square displacement.</value>
    public double ConventionFactor { get; set; } = DefaultConventionFactor;

    /// <summary>The longest interval between samples that is still integrated; a longer one is a gap.</summary>
    /// <value>Default 10 s.</value>
    public TimeSpan MaxGap { get; set; } = TimeSpan.FromSeconds(10);

    /// <summary>Returns the problems with these options; empty when valid.</summary>
    public IReadOnlyList<string> Validate()
    {
        var errors = new List<string>();
        if (!(ConventionFactor > 0) || !double.IsFinite(ConventionFactor))
        {
            errors.Add($"ConventionFactor must be a positive finite number (got {ConventionFactor}).");
        }
        if (MaxGap <= TimeSpan.Zero)
        {
            errors.Add($"MaxGap must be positive (got {MaxGap}).");
        }
        return errors;
    }
}
