namespace RunWatch.Core.Excursions;

/// <summary>The ISA-18.2 alarm lifecycle: condition changes, acknowledge, shelve, unshelve.</summary>
public sealed partial class ExcursionMonitor
{
    /// <summary>
    /// Acknowledges an alarm: active-unacknowledged becomes active-acknowledged, returned-to-normal-unacknowledged
    /// becomes normal. Returns false when there was nothing to acknowledge.
    /// </summary>
    public bool Acknowledge(AlarmKind kind, double nowS)
    {
        ref AlarmSlot slot = ref _alarms[(int)kind];
        AlarmState to = slot.State switch
        {
            AlarmState.ActiveUnacknowledged => AlarmState.ActiveAcknowledged,
            AlarmState.ReturnedToNormalUnacknowledged => AlarmState.Normal,
            _ => slot.State,
        };
        return Move(kind, to, nowS);
    }

    /// <summary>Shelves an alarm until <paramref name="untilS"/>; the condition keeps being tracked.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The expiry is not after <paramref name="nowS"/>.</exception>
    public void Shelve(AlarmKind kind, double untilS, double nowS)
    {
        if (!(untilS > nowS))
        {
            throw new ArgumentOutOfRangeException(nameof(untilS), untilS, "A shelve needs an expiry after now.");
        }
        _alarms[(int)kind].ShelvedUntilS = untilS;
        _earliestShelfExpiryS = Math.Min(_earliestShelfExpiryS, untilS);
        Move(kind, AlarmState.Shelved, nowS);
    }

    /// <summary>Unshelves an alarm: it returns to active-unacknowledged if its condition holds, else to normal.</summary>
    public void Unshelve(AlarmKind kind, double nowS)
    {
        ref AlarmSlot slot = ref _alarms[(int)kind];
        if (slot.State != AlarmState.Shelved)
        {
            return;
        }
        Move(kind, !slot.Condition ? AlarmState.Normal : IsSuppressed(kind) ? AlarmState.SuppressedByDesign : AlarmState.ActiveUnacknowledged, nowS);
    }

    /// <summary>When an alarm's shelve expires (NaN when not shelved).</summary>
    public double ShelvedUntilS(AlarmKind kind) =>
        _alarms[(int)kind].State == AlarmState.Shelved ? _alarms[(int)kind].ShelvedUntilS : double.NaN;

    private void ExpireShelves(double nowS)
    {
        if (!(nowS >= _earliestShelfExpiryS))
        {
            return;
        }
        _earliestShelfExpiryS = double.PositiveInfinity;
        for (int i = 0; i < _alarms.Length; i++)
        {
            if (_alarms[i].State == AlarmState.Shelved && nowS >= _alarms[i].ShelvedUntilS)
            {
                Unshelve((AlarmKind)i, nowS);
            }
            else if (_alarms[i].State == AlarmState.Shelved)
            {
                _earliestShelfExpiryS = Math.Min(_earliestShelfExpiryS, _alarms[i].ShelvedUntilS);
            }
        }
    }

    private void SetCondition(AlarmKind kind, bool active, double timeS)
    {
        ref AlarmSlot slot = ref _alarms[(int)kind];
        if (slot.Condition == active)
        {
            return;
        }
        slot.Condition = active;
        AlarmState to = (slot.State, active) switch
        {
            (AlarmState.Shelved, _) => AlarmState.Shelved,
            (AlarmState.Normal, true) => IsSuppressed(kind) ? AlarmState.SuppressedByDesign : AlarmState.ActiveUnacknowledged,
            (AlarmState.SuppressedByDesign, false) => AlarmState.Normal,
            (AlarmState.ReturnedToNormalUnacknowledged, true) => AlarmState.ActiveUnacknowledged,
            (AlarmState.ActiveUnacknowledged, false) => AlarmState.ReturnedToNormalUnacknowledged,
            (AlarmState.ActiveAcknowledged, false) => AlarmState.Normal,
            _ => slot.State,
        };
        Move(kind, to, timeS);
    }

    private bool Move(AlarmKind kind, AlarmState to, double timeS)
    {
        ref AlarmSlot slot = ref _alarms[(int)kind];
        AlarmState from = slot.State;
        if (from == to)
        {
            return false;
        }
        slot.State = to;
        if (_observer is not null)
        {
            var transition = new AlarmTransition(kind, from, to, timeS, _reportC);
            _observer.OnAlarmChanged(in transition);
        }
        return true;
    }
}
