using RunWatch.Core.Geometry;

namespace RunWatch.Core.Model.Prediction;

/// <summary>The simulated field used by <see cref="NucleationFieldSimulator"/>.</summary>
public sealed record NucleationFieldOptions
{
    /// <summary>Field width (nm).</summary>
    /// <value>20 000 nm (a 20 µm SEM field).</value>
    public double FieldWidthNm { get; init; } = 20_000;

    /// <summary>Field height (nm).</summary>
    /// <value>20 000 nm.</value>
    public double FieldHeightNm { get; init; } = 20_000;

    /// <summary>Site process.</summary>
    /// <value><see cref="NucleationSiteProcess.Poisson"/>.</value>
    public NucleationSiteProcess Process { get; init; } = NucleationSiteProcess.Poisson;

    /// <summary>Minimum site distance for <see cref="NucleationSiteProcess.HardCore"/> (nm).</summary>
    /// <value>0 (must be set for hard-core).</value>
    public double HardCoreDistanceNm { get; init; }

    /// <summary>Which zones count as guarded and are left out, as for measured fields.</summary>
    /// <value><see cref="GuardRule.DiscCrossesEdge"/>.</value>
    public GuardRule GuardRule { get; init; } = GuardRule.DiscCrossesEdge;

    /// <summary>Throws <see cref="ArgumentException"/> for an empty field or a hard-core process without distance.</summary>
    public void Validate()
    {
        if (!(FieldWidthNm > 0) || !(FieldHeightNm > 0) || !double.IsFinite(FieldWidthNm) || !double.IsFinite(FieldHeightNm))
        {
            throw new ArgumentException($"The simulated field must have a positive finite size; got {FieldWidthNm} × {FieldHeightNm} nm.");
        }
        if (Process == NucleationSiteProcess.HardCore && !(HardCoreDistanceNm > 0))
        {
            throw new ArgumentException("A hard-core site process needs HardCoreDistanceNm > 0.");
        }
        if (!Enum.IsDefined(Process))
        {
            throw new ArgumentException($"Unknown site process {Process}.");
        }
    }
}
