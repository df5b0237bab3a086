namespace RunWatch.Core.Model;

/// <summary>One past wafer offered to a process calibration.</summary>
/// <param name="WaferId">Wafer id (recorded in the calibration).</param>
/// <param name="RadiiNm">Measured radius per wire, in the evaluator's wire order.</param>
/// <param name="Evaluator">Â per wire at a given L (for example <see cref="MeasuredCaptureAreas.ForFields"/>).</param>
/// <param name="GrowthDurationS">Actual growth-window duration (s).</param>
/// <param name="EffectiveTemperatureK">T_eff of the run (K).</param>
/// <param name="ConventionFactor">c in L² = c·D·t.</param>
public sealed record WaferCalibrationInput(string WaferId, double[] RadiiNm, CaptureAreaEvaluator Evaluator, double GrowthDurationS, double EffectiveTemperatureK, double ConventionFactor);
