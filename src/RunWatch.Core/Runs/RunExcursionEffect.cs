using RunWatch.Core.Excursions;

namespace RunWatch.Core.Runs;

/// <summary>One excursion of a run and what it did to L_eff.</summary>
/// <param name="Summary">The excursion as the monitor closed it.</param>
/// <param name="InGrowthWindow">Whether any of it falls inside the growth window.</param>
/// <param name="LengthChangeUm">L_eff actual minus L_eff with the excursion's overlap with the growth window at the setpoint, µm; 0 outside the window, NaN when L_eff is undefined.</param>
public readonly record struct RunExcursionEffect(ExcursionSummary Summary, bool InGrowthWindow, double LengthChangeUm);
