using RunWatch.Core.Excursions;
using RunWatch.Core.Thermal;

namespace RunWatch.Core.Runs;

/// <summary>The thermal figures of one run: diffusion length over the growth window, and the excursions of the whole record.</summary>
/// <param name="Length">L_nom, L_eff, T_eff, coverage and gaps over the growth window.</param>
/// <param name="Excursions">Every excursion of the record, in time order, each with its effect on L_eff.</param>
/// <param name="OtherAlarms">Alarms other than the deviation bands that became active (limits, rate, flatline, stale).</param>
public sealed record RunThermalEvaluation(
    DiffusionLengthResult Length,
    IReadOnlyList<RunExcursionEffect> Excursions,
    IReadOnlyList<AlarmTransition> OtherAlarms);
