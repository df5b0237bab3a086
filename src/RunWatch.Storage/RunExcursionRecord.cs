using RunWatch.Core.Excursions;

namespace RunWatch.Storage;

/// <summary>One excursion of a closed run (<see cref="RunRecord.Excursions"/>), as the run tracker found it.</summary>
/// <param name="Start">Start (UTC).</param>
/// <param name="End">End (UTC).</param>
/// <param name="DurationS">Duration, s.</param>
/// <param name="PeakDeviationK">Signed peak deviation from the setpoint, K.</param>
/// <param name="PeakValueC">True temperature at the peak, °C.</param>
/// <param name="Severity">Highest band reached.</param>
/// <param name="LengthChangeNm">Its effect on L_eff, nm (L_eff actual minus L_eff with the part of the excursion inside the growth window at the setpoint; 0 outside it).</param>
/// <param name="Closed">False when the run ended during the excursion.</param>
/// <param name="InGrowthWindow">Whether any of it falls inside the growth window (only that part changes L_eff). Records stored before the flag existed read as inside, as they were shown.</param>
/// <param name="SuppressedByDesign">Whether it fell wholly on a ramp towards a new setpoint, where deviation alarms are suppressed by design (recorded, not counted). Older records read as false.</param>
public sealed record RunExcursionRecord(DateTimeOffset Start, DateTimeOffset End, double DurationS, double PeakDeviationK, double PeakValueC,
    ExcursionSeverity Severity, double? LengthChangeNm, bool Closed = true, bool InGrowthWindow = true, bool SuppressedByDesign = false);
