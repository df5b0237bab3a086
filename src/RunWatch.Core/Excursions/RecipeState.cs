namespace RunWatch.Core.Excursions;

/// <summary>The process state the monitor judges deviation alarms in (see <see cref="DeviationAlarmRule"/>).</summary>
public enum RecipeState
{
    /// <summary>No setpoint is known: deviation is not judged.</summary>
    NoSetpoint = 0,

    /// <summary>The setpoint moved and the reading has not yet come within band of it.</summary>
    Ramp,

    /// <summary>The reading has come within band of the setpoint (or the ramp timed out).</summary>
    Hold,

    /// <summary>The growth shutter is open.</summary>
    Growth,
}
