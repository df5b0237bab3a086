namespace RunWatch.Core.Model.Prediction;

/// <summary>What a prediction before SEM is made from.</summary>
/// <param name="Model">The accepted radius model of the process.</param>
/// <param name="CaptureRadiusNm">The run's L_eff (nm), the capture radius the simulator uses.</param>
/// <param name="DensityPerCm2">The process's recent nucleation density (cm⁻²), the simulator's density.</param>
/// <param name="Fields">Number of simulated fields (replicates).</param>
/// <param name="Seed">Base seed; field i uses seed + i, so a prediction is reproducible.</param>
public sealed record RadiusPredictionRequest(RadiusModelFit Model, double CaptureRadiusNm, double DensityPerCm2, int Fields, int Seed);
