namespace RunWatch.Web;

/// <summary>
/// Process parameters the planner uses when the process has no accepted model (section RunWatch:Dashboard:Planner).
/// The planner page shows them, so nobody mistakes them for a fitted model.
/// </summary>
public sealed class PlannerOptions
{
    /// <summary>Arrhenius prefactor D0 in cm²/s.</summary>
    public double D0CmSquaredPerSecond { get; set; } = 2.5e-5;

    /// <summary>Activation energy Ea in eV.</summary>
    public double ActivationEnergyEv { get; set; } = 1.3;

    /// <summary>Convention factor c of L = √(c·∫D dt) for the default diffusivity (1 for L = √(D·t)).</summary>
    public double ConventionFactor { get; set; } = RunWatch.Core.Thermal.DiffusionLengthOptions.DefaultConventionFactor;

    /// <summary>Radius model intercept A in nm (r = A + B·Â).</summary>
    public double RadiusInterceptNm { get; set; } = 20.4;

    /// <summary>Radius model slope B in nm (r = A + B·Â).</summary>
    public double RadiusSlopeNm { get; set; } = 21.6;
}
