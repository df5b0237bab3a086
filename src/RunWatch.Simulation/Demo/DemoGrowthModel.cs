namespace RunWatch.Simulation.Demo;

/// <summary>
/// A stand-in radius law for quick pipeline-test fields (not the demo's truth, which is grown by the adatom simulation): r = K·Â^P with seeded scatter. Mass balance at fixed
/// wire height gives P ≈ 0.5 (volume ∝ collected area, r ∝ √volume). Demo data only; no real process behaves
/// exactly like this.
/// </summary>
/// <param name="KNm">Radius of a wire whose zone is a full disc (Â = 1), nm.</param>
/// <param name="P">Exponent.</param>
/// <param name="ScatterNm">Standard deviation of the radius scatter around the law, nm.</param>
public sealed record DemoGrowthModel(double KNm = 56, double P = 0.5, double ScatterNm = 1.5)
{
    /// <summary>Radius for normalised capture area <paramref name="normalisedArea"/>, before scatter.</summary>
    public double RadiusNm(double normalisedArea) => KNm * Math.Pow(Math.Max(normalisedArea, 1e-6), P);
}
