namespace RunWatch.Core.Model.Prediction;

/// <summary>One past wafer's measured wire density.</summary>
/// <param name="WaferId">Wafer.</param>
/// <param name="GrownAt">When its run ended.</param>
/// <param name="DensityPerCm2">Measured density (cm⁻²).</param>
public sealed record WaferDensity(string WaferId, DateTimeOffset GrownAt, double DensityPerCm2);
