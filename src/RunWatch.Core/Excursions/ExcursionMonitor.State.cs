namespace RunWatch.Core.Excursions;

/// <summary>
/// State-based alarming: the process state (ramp, hold, growth) that decides whether deviation alarms are raised
/// or suppressed by design (<see cref="DeviationAlarmRule"/>).
/// </summary>
public sealed partial class ExcursionMonitor
{
    private RecipeState _state;
    private bool _growth;
    private bool _hasSetpointRef;
    private double _setpointRefC;
    private double _rampStartS;
    private bool _deviationSuppressed;
    private bool _releasePending;

    /// <summary>The process state deviation alarms are judged in.</summary>
    public RecipeState State => _growth ? RecipeState.Growth : _state;

    /// <summary>Whether deviation alarms are now suppressed by design (the rule and a ramp).</summary>
    public bool DeviationSuppressed => _deviationSuppressed;

    /// <summary>Tells the monitor whether the growth shutter is open: while it is, the state is Growth and deviation alarms apply.</summary>
    public void SetGrowth(bool open, double timeS)
    {
        if (_growth == open)
        {
            return;
        }
        _growth = open;
        ApplySuppression();
        ReleaseSuppressed(timeS);
    }

    /// <summary>Moves the state for this sample: a setpoint move starts a ramp; arrival within band, or the timeout, ends it.</summary>
    private void UpdateRecipeState(double timeS, double valueC, double setpointC)
    {
        if (!double.IsFinite(setpointC))
        {
            _state = RecipeState.NoSetpoint;
            _hasSetpointRef = false;
        }
        else
        {
            if (!_hasSetpointRef || Math.Abs(setpointC - _setpointRefC) > _setpointChangeK)
            {
                // A setpoint ramped by the controller moves the reference step by step, so the timeout counts from its last move.
                _hasSetpointRef = true;
                _setpointRefC = setpointC;
                _rampStartS = timeS;
                _state = RecipeState.Ramp;
            }
            if (_state == RecipeState.Ramp
                && (Math.Abs(valueC - setpointC) <= _warningBandK - _hysteresisK || timeS - _rampStartS > _rampTimeoutS))
            {
                _state = RecipeState.Hold;
            }
        }
        ApplySuppression();
    }

    private void ApplySuppression()
    {
        bool suppress = _rule == DeviationAlarmRule.HoldAndGrowth && !_growth && _state == RecipeState.Ramp;
        if (suppress == _deviationSuppressed)
        {
            return;
        }
        _deviationSuppressed = suppress;
        if (!suppress)
        {
            _releasePending = true;
        }
    }

    /// <summary>
    /// After the band checks of the sample that ended a ramp: a deviation condition that still holds (the ramp timed
    /// out, or growth began off setpoint) is raised now; one that cleared on arrival went back to normal unraised.
    /// </summary>
    private void ReleaseSuppressed(double timeS)
    {
        if (!_releasePending || _deviationSuppressed)
        {
            _releasePending = false;
            return;
        }
        _releasePending = false;
        Release(AlarmKind.DeviationWarning, timeS);
        Release(AlarmKind.DeviationAlarm, timeS);
    }

    private void Release(AlarmKind kind, double timeS)
    {
        ref AlarmSlot slot = ref _alarms[(int)kind];
        if (slot.State == AlarmState.SuppressedByDesign)
        {
            Move(kind, slot.Condition ? AlarmState.ActiveUnacknowledged : AlarmState.Normal, timeS);
        }
    }

    private bool IsSuppressed(AlarmKind kind) =>
        _deviationSuppressed && kind is AlarmKind.DeviationWarning or AlarmKind.DeviationAlarm;
}
