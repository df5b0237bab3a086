namespace RunWatch.Ingest.Runs;

/// <summary>Further figures of a run as stored in <c>runs.summary_json</c>.</summary>
/// <param name="ConventionFactor">c in L = sqrt(c·∫D dt); goes with every length.</param>
/// <param name="IntegralCmSq">∫D dt over the covered window, cm².</param>
/// <param name="CoveredS">Covered time, s.</param>
/// <param name="WindowStartS">Growth window start, s after the run start.</param>
/// <param name="WindowEndS">Growth window end, s after the run start.</param>
/// <param name="GapCount">Gaps longer than the gap limit.</param>
/// <param name="IsComplete">False when the record has such gaps (the lengths cover the recorded part only).</param>
/// <param name="LogSensitivityPerK">d(ln L)/dT at T_eff, 1/K.</param>
/// <param name="SampleCount">Temperature samples used.</param>
/// <param name="HasPlan">Whether L_nom could be computed (setpoint and planned time known).</param>
/// <param name="Error">Why figures are missing, if they are.</param>
internal sealed record RunSummaryJson(double ConventionFactor, double IntegralCmSq, double CoveredS, double WindowStartS, double WindowEndS,
    int GapCount, bool IsComplete, double? LogSensitivityPerK, int SampleCount, bool HasPlan, string? Error);
