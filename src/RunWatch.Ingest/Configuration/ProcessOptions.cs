using RunWatch.Core.Thermal;

namespace RunWatch.Ingest.Configuration;

/// <summary>Surface-diffusion parameters of the chamber's process, D(T) = D0·exp(−Ea/(kB·T)).</summary>
public sealed class ProcessOptions
{
    /// <summary>Pre-exponential factor, cm²/s. The default is an invented example value: set it per process.</summary>
    public double D0CmSqPerS { get; set; } = 1.0e-2;

    /// <summary>Activation energy, eV. The default is an invented example value: set it per process.</summary>
    public double EaEv { get; set; } = 1.3;

    /// <summary>The Core diffusivity.</summary>
    public ArrheniusDiffusivity Diffusivity => new(D0CmSqPerS, EaEv);
}
