namespace RunWatch.Core.Model;

/// <summary>One wafer's input to the Arrhenius calibration.</summary>
/// <param name="WaferId">Wafer the best-fit capture radius came from.</param>
/// <param name="CaptureRadiusNm">Best-fit capture radius L (nm), taken as the diffusion length.</param>
/// <param name="GrowthDurationS">Actual growth-window duration t (s).</param>
/// <param name="EffectiveTemperatureK">T_eff (K): the constant temperature giving the run's ∫D dt over t.</param>
/// <param name="ConventionFactor">c in L² = c·D·t (1 for L = √(D·t), 4 for the 2-D mean-square displacement).</param>
public sealed record ArrheniusPoint(string WaferId, double CaptureRadiusNm, double GrowthDurationS, double EffectiveTemperatureK, double ConventionFactor);
