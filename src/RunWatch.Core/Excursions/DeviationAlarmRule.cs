namespace RunWatch.Core.Excursions;

/// <summary>
/// When deviation-from-setpoint alarms may be raised: the stated rule of state-based alarming (ISA-18.2 "designed
/// suppression": an alarm that is meaningless in a process state is suppressed by design in that state).
/// </summary>
public enum DeviationAlarmRule
{
    /// <summary>Deviation alarms are judged in every state (no state-based suppression).</summary>
    Always = 0,

    /// <summary>
    /// Deviation alarms are raised only in Hold and Growth. From a setpoint change until the reading first comes within
    /// the warning band less the hysteresis of the new setpoint (Ramp), deviation conditions are suppressed by design:
    /// tracked and reported as <see cref="AlarmState.SuppressedByDesign"/>, never raised. A ramp ends after
    /// <see cref="ExcursionOptions.RampTimeout"/> even if the reading never arrives (a heater that cannot reach its
    /// setpoint is a fault worth an alarm), and while the growth shutter is open the state is Growth, never Ramp.
    /// </summary>
    HoldAndGrowth = 1,
}
