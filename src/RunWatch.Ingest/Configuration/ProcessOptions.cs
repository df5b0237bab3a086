namespace RunWatch.Ingest.Configuration;

/// <summary>Surface-diffusion parameters of the chamber's process, D(T) = D0·exp(−Ea/(kB·T)).</summary>
public sealed class ProcessOptions
{
    /// <summary>Pre-exponential factor, cm²/s. Invented example value by default; set it per process.</summary>
    public double D0Cm2PerS { get; set; } = 1.0e-2;

    /// <summary>Activation energy, eV. Invented example value by default; set it per process.</summary>
    public double EaEv { get; set; } = 1.3;

    /// <summary>Convention factor c in L = sqrt(c·∫D dt): 1 for L = sqrt(D·t), 4 for the 2-D mean-square displacement. <value>Default 1.</value></summary>
    public double ConventionFactor { get; set; } = 1.0;
}
