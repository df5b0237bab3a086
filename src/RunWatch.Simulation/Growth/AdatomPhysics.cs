namespace RunWatch.Simulation.Growth;

/// <summary>
/// The invented "true" adatom physics behind the demo's wafers (demo data; no real process is described). Adatoms
/// land at a flux, diffuse with D(T) = D₀·exp(−E_D/kT) and desorb after τ(T) = τ₀·exp(E_des/kT) (both Arrhenius, the
/// usual picture of surface diffusion with desorption; COMMON PRACTICE, no source), so the capture length is
/// λ = √(D·τ). A wire keeps what reaches it; at fixed height h its volume π·(r² − r₀²)·h equals the planar-equivalent
/// growth rate G times the substrate area-time it collected (mass balance, DERIVED).
/// </summary>
/// <remarks>
/// Default numbers (all invented, chosen to sit in ranges typical of self-catalysed GaAs wires on silicon as we
/// remember them, FROM MEMORY, unchecked): λ = 0.35, 0.30, 0.26 µm at 590, 610, 630 °C (reported values span
/// roughly 0.1–2 µm), hotter growth shortening λ (E_des &gt; E_D, as for Ga on oxide-covered silicon), wire radii
/// 20–80 nm, heights of a few µm, a planar-equivalent rate of 0.08 nm/s reaching the wires (GaAs layers are commonly
/// grown at 0.1–1 nm/s).
/// </remarks>
/// <param name="DiffusivityPrefactorUm2PerS">D₀ (µm²/s).</param>
/// <param name="DiffusionBarrierEv">E_D (eV).</param>
/// <param name="LifetimePrefactorS">τ₀ (s).</param>
/// <param name="DesorptionEnergyEv">E_des (eV).</param>
/// <param name="GrowthRateNmPerS">G: planar-equivalent volume rate of the adatoms that a wire collects (nm³ per nm² per s).</param>
/// <param name="WireHeightNm">h: wire height, held fixed (nm).</param>
/// <param name="SeedRadiusNm">Mean r₀: the radius a wire has before it collects (its droplet-defined start), nm.</param>
/// <param name="SeedRadiusSdNm">Wire-to-wire SD of r₀ (nm).</param>
/// <param name="MeanNucleationDelayS">Mean of the exponential delay after the shutter opens before a wire starts to collect (s).</param>
public sealed record AdatomPhysics(
    double DiffusivityPrefactorUm2PerS = 1.5e6,
    double DiffusionBarrierEv = 1.3,
    double LifetimePrefactorS = 1.2e-13,
    double DesorptionEnergyEv = 2.3,
    double GrowthRateNmPerS = 0.08,
    double WireHeightNm = 2500,
    double SeedRadiusNm = 20,
    double SeedRadiusSdNm = 1.5,
    double MeanNucleationDelayS = 45)
{
    /// <summary>Boltzmann constant in eV/K, from Core's exact SI constants (a constant of nature, not the model under test).</summary>
    public const double BoltzmannEvPerK = RunWatch.Core.Thermal.PhysicalConstants.BoltzmannEvPerK;

    /// <summary>D at <paramref name="temperatureC"/> (µm²/s).</summary>
    public double DiffusivityUm2PerS(double temperatureC) => DiffusivityPrefactorUm2PerS * Math.Exp(-DiffusionBarrierEv / (BoltzmannEvPerK * (temperatureC + RunWatch.Core.Thermal.PhysicalConstants.ZeroCelsiusK)));

    /// <summary>τ at <paramref name="temperatureC"/> (s).</summary>
    public double LifetimeS(double temperatureC) => LifetimePrefactorS * Math.Exp(DesorptionEnergyEv / (BoltzmannEvPerK * (temperatureC + RunWatch.Core.Thermal.PhysicalConstants.ZeroCelsiusK)));

    /// <summary>λ = √(D·τ) at <paramref name="temperatureC"/> (µm).</summary>
    public double CaptureLengthUm(double temperatureC) => Math.Sqrt(DiffusivityUm2PerS(temperatureC) * LifetimeS(temperatureC));

    /// <summary>Radius (nm) of a wire that started at <paramref name="seedRadiusNm"/> and collected <paramref name="areaTimeUm2S"/> (µm²·s) of substrate.</summary>
    public double RadiusNm(double seedRadiusNm, double areaTimeUm2S) =>
        Math.Sqrt((seedRadiusNm * seedRadiusNm) + (GrowthRateNmPerS * areaTimeUm2S * 1e6 / (Math.PI * WireHeightNm)));
}
