using RunWatch.Core.Thermal;

namespace RunWatch.Core.Excursions;

/// <summary>Band checks around the setpoint and the excursion being tracked.</summary>
public sealed partial class ExcursionMonitor
{
    private void CheckDeviation(double timeS, double valueC, double setpointC)
    {
        UpdateRecipeState(timeS, valueC, setpointC);
        if (!double.IsFinite(setpointC))
        {
            CloseOpen(timeS, closed: false);
            ResetDeviation(timeS);
            ReleaseSuppressed(timeS);
            return;
        }
        double deviation = valueC - setpointC;
        double magnitude = Math.Abs(deviation);

        if (_alarm.Update(magnitude, _alarmBandK, _hysteresisK, _minimumS, timeS))
        {
            SetCondition(AlarmKind.DeviationAlarm, _alarm.Active, timeS);
        }
        bool warningChanged = _warning.Update(magnitude, _warningBandK, _hysteresisK, _minimumS, timeS);
        bool inExcursion = _warning.Pending || _warning.Active;

        if (inExcursion && !_open.IsOpen)
        {
            _open = new OpenExcursion
            {
                IsOpen = true, StartS = timeS, PeakDeviationK = deviation, PeakTimeS = timeS, PeakValueC = valueC, Suppressed = _deviationSuppressed,
            };
        }
        if (_open.IsOpen)
        {
            AccumulateExcess(timeS, valueC, setpointC, inExcursion);
            if (magnitude > Math.Abs(_open.PeakDeviationK))
            {
                _open.PeakDeviationK = deviation;
                _open.PeakTimeS = timeS;
                _open.PeakValueC = valueC;
            }
            if (_alarm.Active)
            {
                _open.Severity = ExcursionSeverity.Alarm;
            }
            if (_warning.Active)
            {
                _open.Qualified = true;
            }
            if (inExcursion && !_deviationSuppressed)
            {
                // Any part of it outside a suppressing state makes it an alarm-worthy excursion.
                _open.Suppressed = false;
            }
        }
        if (warningChanged)
        {
            SetCondition(AlarmKind.DeviationWarning, _warning.Active, timeS);
        }
        if (_open.IsOpen && !inExcursion)
        {
            // Back inside band − hysteresis: a qualified excursion ends here, a short blip is dropped.
            CloseOpen(timeS, closed: true);
        }
        _lastInExcursion = inExcursion;
        ReleaseSuppressed(timeS);
    }

    // ∫D dt actual minus ∫D dt with excursion samples replaced by their setpoint, for the segment ending now.
    private void AccumulateExcess(double timeS, double valueC, double setpointC, bool currentInExcursion)
    {
        if (!_hasDiffusivity || !_hasLast || timeS - _lastS > _maxGapS || !double.IsFinite(_lastSetpointC))
        {
            return;
        }
        double dt = timeS - _lastS;
        double startK = _lastC + PhysicalConstants.ZeroCelsiusK;
        double endK = valueC + PhysicalConstants.ZeroCelsiusK;
        double startReplacedK = (_lastInExcursion ? _lastSetpointC : _lastC) + PhysicalConstants.ZeroCelsiusK;
        double endReplacedK = (currentInExcursion ? setpointC : valueC) + PhysicalConstants.ZeroCelsiusK;
        double actual = ThermalIntegrator.SegmentIntegralS(dt, startK, endK, _activationK);
        double replaced = ThermalIntegrator.SegmentIntegralS(dt, startReplacedK, endReplacedK, _activationK);
        _open.ExcessIntegralCmSq += _d0 * (actual - replaced);
    }

    private void CloseOpen(double timeS, bool closed)
    {
        if (!_open.IsOpen)
        {
            return;
        }
        bool qualified = _open.Qualified || _warning.Active;
        if (qualified && _observer is not null)
        {
            var summary = new ExcursionSummary(
                _open.StartS,
                timeS,
                _open.PeakDeviationK,
                _open.PeakTimeS,
                _open.PeakValueC,
                _open.Severity,
                _hasDiffusivity ? _open.ExcessIntegralCmSq : double.NaN,
                closed,
                _open.Suppressed);
            _observer.OnExcursionEnded(in summary);
        }
        _open = default;
    }

    private void ResetDeviation(double timeS)
    {
        _warning.Reset();
        _alarm.Reset();
        _lastInExcursion = false;
        SetCondition(AlarmKind.DeviationWarning, false, timeS);
        SetCondition(AlarmKind.DeviationAlarm, false, timeS);
    }

    private struct OpenExcursion
    {
        public bool IsOpen;
        public bool Qualified;
        public double StartS;
        public double PeakDeviationK;
        public double PeakTimeS;
        public double PeakValueC;
        public ExcursionSeverity Severity;
        public double ExcessIntegralCmSq;

        // True while every sample of it fell in a state where deviation alarms are suppressed by design.
        public bool Suppressed;
    }
}
