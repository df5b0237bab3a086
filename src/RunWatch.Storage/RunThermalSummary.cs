using RunWatch.Core.Thermal;

namespace RunWatch.Storage;

/// <summary>
/// Further thermal figures of a closed run (<see cref="RunRecord.Summary"/>), written once by the run tracker and read
/// by every room through this type; the store alone serialises it (<see cref="RunThermalJson"/>).
/// </summary>
/// <param name="ConventionFactor">c in L = sqrt(c·∫D dt); goes with every length of the run.</param>
/// <param name="IntegralCmSq">∫D dt over the covered part of the growth window, cm².</param>
/// <param name="CoveredS">Covered time, s.</param>
/// <param name="WindowStartS">Growth window start, s after the run start.</param>
/// <param name="WindowEndS">Growth window end, s after the run start.</param>
/// <param name="GapCount">Gaps longer than the gap limit.</param>
/// <param name="IsComplete">False when the record has such gaps (the lengths cover the recorded part only).</param>
/// <param name="LogSensitivityPerK">d(ln L)/dT at T_eff, 1/K.</param>
/// <param name="SampleCount">Temperature samples used.</param>
/// <param name="HasPlan">Whether L_nom could be computed (setpoint and planned time known).</param>
/// <param name="Error">Why figures are missing, if they are.</param>
public sealed record RunThermalSummary(double ConventionFactor, double IntegralCmSq, double CoveredS, double WindowStartS, double WindowEndS,
    int GapCount, bool IsComplete, double? LogSensitivityPerK, int SampleCount, bool HasPlan, string? Error)
{
    /// <summary>A summary that only says why the run has no figures.</summary>
    public static RunThermalSummary Failed(string error) => new(0, 0, 0, 0, 0, 0, false, null, 0, false, error);

    /// <summary>
    /// The convention factor the run's lengths were computed with; where the run has none recorded, the one default
    /// (<see cref="DiffusionLengthOptions.DefaultConventionFactor"/>).
    /// </summary>
    public static double ConventionFactorOf(RunRecord? run) =>
        run?.Summary is { ConventionFactor: var c } && c > 0 && double.IsFinite(c) ? c : DiffusionLengthOptions.DefaultConventionFactor;

    /// <summary>The run's growth window in seconds from its start; the whole run when none is recorded.</summary>
    public static GrowthWindow GrowthWindowOf(RunRecord run)
    {
        ArgumentNullException.ThrowIfNull(run);
        double whole = ((run.EndedAt ?? run.LastSampleAt ?? run.StartedAt) - run.StartedAt).TotalSeconds;
        return run.Summary is { WindowStartS: var start, WindowEndS: var end } && double.IsFinite(start) && double.IsFinite(end) && end > start
            ? new GrowthWindow(start, end)
            : new GrowthWindow(0, whole);
    }

    /// <summary>
    /// The run-end figures of the process's accepted diffusion radius model (<see cref="ModelKinds.Diffusion"/>);
    /// null when the process has no accepted diffusion model (the figures above are then the only ones).
    /// </summary>
    public RunDiffusionFigures? Diffusion { get; init; }
}
