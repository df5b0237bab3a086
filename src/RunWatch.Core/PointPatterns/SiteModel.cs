namespace RunWatch.Core.PointPatterns;

/// <summary>How nucleation sites are simulated for a prediction.</summary>
/// <param name="Process">The random process.</param>
/// <param name="Density">Sites per unit² of the length unit used (e.g. µm⁻²): the density the simulation aims for.</param>
/// <param name="MinDistance">Hard-core distance for the hard-core processes (same length unit); ignored for Poisson.</param>
public sealed record SiteModel(SiteProcess Process, double Density, double MinDistance = 0.0)
{
    /// <summary>Throws <see cref="ArgumentException"/> for a density or distance out of range.</summary>
    public void Validate()
    {
        if (!double.IsFinite(Density) || Density <= 0.0)
        {
            throw new ArgumentException($"site density must be a finite number > 0 (got {Density})");
        }
        if (Process == SiteProcess.Poisson)
        {
            return;
        }
        if (!Enum.IsDefined(Process))
        {
            throw new ArgumentException($"unknown site process {Process}");
        }
        if (!double.IsFinite(MinDistance) || MinDistance <= 0.0)
        {
            throw new ArgumentException($"hard-core processes need a minimum distance > 0 (got {MinDistance})");
        }
        double packing = Density * Math.PI * MinDistance * MinDistance;
        // Matérn II cannot exceed 1/(π d²) (DERIVED from its retention formula); RSA jams near 0.547·4/(π d²).
        double limit = Process == SiteProcess.MaternHardCore ? 1.0 : 4.0 * 0.547;
        if (packing >= limit)
        {
            throw new ArgumentException(
                $"density {Density:G4} with minimum distance {MinDistance:G4} is beyond what {Process} can reach (λπd² = {packing:G3} ≥ {limit:G3})");
        }
    }
}
