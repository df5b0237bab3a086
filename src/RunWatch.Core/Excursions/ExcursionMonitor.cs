using RunWatch.Core.Thermal;

namespace RunWatch.Core.Excursions;

/// <summary>
/// Streaming excursion detection for one channel, fed sample by sample (true °C, times in seconds on any clock that
/// never goes backwards). Watches the warning and alarm bands around the setpoint (minimum duration, hysteresis),
/// absolute high/low limits, the rate of change, stale data and flatline, and keeps an ISA-18.2 alarm state per
/// condition. Deviation alarms follow the configured state-based rule (<see cref="DeviationAlarmRule"/>): on a ramp
/// towards a new setpoint they are suppressed by design. Allocates nothing per sample. Not thread-safe: feed it from one thread.
/// </summary>
public sealed partial class ExcursionMonitor
{
    private static readonly int KindCount = Enum.GetValues<AlarmKind>().Length;

    private readonly IExcursionObserver? _observer;
    private readonly double _activationK;
    private readonly double _d0;
    private readonly bool _hasDiffusivity;
    private readonly double _warningBandK;
    private readonly double _alarmBandK;
    private readonly double _hysteresisK;
    private readonly double _minimumS;
    private readonly double _highLimitC;
    private readonly double _lowLimitC;
    private readonly double _maxRateKPerS;
    private readonly double _rateWindowS;
    private readonly double _staleS;
    private readonly double _flatlineS;
    private readonly double _flatlineEpsilonK;
    private readonly double _maxGapS;
    private readonly DeviationAlarmRule _rule;
    private readonly double _setpointChangeK;
    private readonly double _rampTimeoutS;
    private readonly AlarmSlot[] _alarms;

    private BandDetector _warning;
    private BandDetector _alarm;
    private bool _runActive;
    private double _runStartS;
    private bool _hasLast;
    private double _lastS;
    private double _lastC;
    private double _lastSetpointC;
    private bool _lastInExcursion;
    private double _reportC = double.NaN;
    private double _earliestShelfExpiryS = double.PositiveInfinity;
    private double _rateAnchorS;
    private double _rateAnchorC;
    private double _flatAnchorS;
    private double _flatAnchorC;
    private OpenExcursion _open;

    /// <summary>Creates a monitor. With <paramref name="diffusivity"/>, each excursion also reports its effect on ∫D dt.</summary>
    /// <exception cref="ArgumentException">The options are invalid.</exception>
    public ExcursionMonitor(ExcursionOptions options, ArrheniusDiffusivity? diffusivity = null, IExcursionObserver? observer = null)
    {
        ArgumentNullException.ThrowIfNull(options);
        var problems = options.Validate();
        if (problems.Count > 0)
        {
            throw new ArgumentException(string.Join(" ", problems), nameof(options));
        }
        _observer = observer;
        _hasDiffusivity = diffusivity.HasValue;
        _activationK = diffusivity?.ActivationTemperatureK ?? 0;
        _d0 = diffusivity?.D0CmSqPerS ?? 0;
        _warningBandK = options.WarningBandK;
        _alarmBandK = options.AlarmBandK;
        _hysteresisK = options.HysteresisK;
        _minimumS = options.MinimumDuration.TotalSeconds;
        _highLimitC = options.HighLimitC ?? double.PositiveInfinity;
        _lowLimitC = options.LowLimitC ?? double.NegativeInfinity;
        _maxRateKPerS = options.MaxRateKPerS ?? double.PositiveInfinity;
        _rateWindowS = options.RateWindow.TotalSeconds;
        _staleS = options.StaleAfter?.TotalSeconds ?? double.PositiveInfinity;
        _flatlineS = options.FlatlineWindow?.TotalSeconds ?? double.PositiveInfinity;
        _flatlineEpsilonK = options.FlatlineEpsilonK;
        _maxGapS = options.MaxGap.TotalSeconds;
        _rule = options.DeviationAlarming;
        _setpointChangeK = options.SetpointChangeK;
        _rampTimeoutS = options.RampTimeout?.TotalSeconds ?? double.PositiveInfinity;
        _alarms = new AlarmSlot[KindCount];
    }

    /// <summary>True between <see cref="BeginRun"/> and <see cref="EndRun"/>.</summary>
    public bool RunActive => _runActive;

    /// <summary>Samples ignored because their time went backwards or a value was not finite.</summary>
    public long RejectedSamples { get; private set; }

    /// <summary>True while an excursion is open (pending or qualified).</summary>
    public bool ExcursionOpen => _open.IsOpen;

    /// <summary>The ISA-18.2 state of one alarm.</summary>
    public AlarmState GetState(AlarmKind kind) => _alarms[(int)kind].State;

    /// <summary>Whether the raw condition of one alarm currently holds (also while it is shelved).</summary>
    public bool IsConditionActive(AlarmKind kind) => _alarms[(int)kind].Condition;

    /// <summary>Starts a run: stale and flatline checks apply from now.</summary>
    public void BeginRun(double timeS)
    {
        _runActive = true;
        _runStartS = timeS;
        _flatAnchorS = timeS;
        _flatAnchorC = _hasLast ? _lastC : double.NaN;
    }

    /// <summary>Ends the run: stale and flatline conditions clear, and an open excursion is closed at <paramref name="timeS"/>.</summary>
    public void EndRun(double timeS)
    {
        _runActive = false;
        SetCondition(AlarmKind.Stale, false, timeS);
        SetCondition(AlarmKind.Flatline, false, timeS);
        CloseOpen(timeS, closed: false);
        ResetDeviation(timeS);
    }

    /// <summary>Closes an open excursion at the end of the data without ending the run.</summary>
    public void Flush(double timeS) => CloseOpen(timeS, closed: false);

    /// <summary>
    /// Feeds one sample: the true temperature <paramref name="valueC"/> at <paramref name="timeS"/>, and the
    /// setpoint then (NaN when there is none, which suspends the band checks). Returns false when the sample was
    /// rejected (time went backwards, or not finite).
    /// </summary>
    public bool Observe(double timeS, double valueC, double setpointC)
    {
        if (!double.IsFinite(timeS) || !double.IsFinite(valueC) || (_hasLast && timeS < _lastS))
        {
            RejectedSamples++;
            return false;
        }
        _reportC = valueC;
        ExpireShelves(timeS);
        SetCondition(AlarmKind.Stale, false, timeS);
        CheckLimits(timeS, valueC);
        CheckRate(timeS, valueC);
        CheckFlatline(timeS, valueC);
        CheckDeviation(timeS, valueC, setpointC);
        _hasLast = true;
        _lastS = timeS;
        _lastC = valueC;
        _lastSetpointC = setpointC;
        return true;
    }

    /// <summary>A clock tick without a sample: expires shelves and raises the stale alarm when data stopped during a run.</summary>
    public void Tick(double nowS)
    {
        ExpireShelves(nowS);
        if (_runActive)
        {
            double since = _hasLast ? Math.Max(_lastS, _runStartS) : _runStartS;
            if (nowS - since > _staleS)
            {
                SetCondition(AlarmKind.Stale, true, nowS);
            }
        }
    }

    private void CheckLimits(double timeS, double valueC)
    {
        bool high = _alarms[(int)AlarmKind.HighLimit].Condition
            ? valueC > _highLimitC - _hysteresisK
            : valueC > _highLimitC;
        SetCondition(AlarmKind.HighLimit, high, timeS);
        bool low = _alarms[(int)AlarmKind.LowLimit].Condition
            ? valueC < _lowLimitC + _hysteresisK
            : valueC < _lowLimitC;
        SetCondition(AlarmKind.LowLimit, low, timeS);
    }

    private void CheckRate(double timeS, double valueC)
    {
        if (!_hasLast || timeS - _lastS > _maxGapS)
        {
            _rateAnchorS = timeS;
            _rateAnchorC = valueC;
            return;
        }
        double span = timeS - _rateAnchorS;
        if (span >= _rateWindowS)
        {
            double rate = Math.Abs(valueC - _rateAnchorC) / span;
            SetCondition(AlarmKind.RateOfChange, rate > _maxRateKPerS, timeS);
            _rateAnchorS = timeS;
            _rateAnchorC = valueC;
        }
    }

    private void CheckFlatline(double timeS, double valueC)
    {
        if (!_runActive)
        {
            return;
        }
        if (double.IsNaN(_flatAnchorC) || Math.Abs(valueC - _flatAnchorC) > _flatlineEpsilonK)
        {
            _flatAnchorS = timeS;
            _flatAnchorC = valueC;
            SetCondition(AlarmKind.Flatline, false, timeS);
        }
        else if (timeS - _flatAnchorS >= _flatlineS)
        {
            SetCondition(AlarmKind.Flatline, true, timeS);
        }
    }
}
