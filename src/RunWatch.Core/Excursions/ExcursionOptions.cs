namespace RunWatch.Core.Excursions;

/// <summary>Limits for one channel's <see cref="ExcursionMonitor"/>. Bound from the section <c>Excursions</c>. Temperatures are true °C.</summary>
public sealed class ExcursionOptions
{
    /// <summary>Half-width of the warning band around the setpoint, K.</summary>
    /// <value>Default 5 K.</value>
    public double WarningBandK { get; set; } = 5;

    /// <summary>Half-width of the alarm band around the setpoint, K (≥ the warning band).</summary>
    /// <value>Default 15 K.</value>
    public double AlarmBandK { get; set; } = 15;

    /// <summary>A band or limit clears only once the reading is this far back inside it, K.</summary>
    /// <value>Default 1 K.</value>
    public double HysteresisK { get; set; } = 1;

    /// <summary>How long a deviation must last before it counts (shorter blips are ignored).</summary>
    /// <value>Default 5 s.</value>
    public TimeSpan MinimumDuration { get; set; } = TimeSpan.FromSeconds(5);

    /// <summary>Absolute high limit, °C; null disables it. A software record only: it never replaces a hardware over-temperature interlock.</summary>
    public double? HighLimitC { get; set; }

    /// <summary>Absolute low limit, °C; null disables it.</summary>
    public double? LowLimitC { get; set; }

    /// <summary>Largest allowed |dT/dt|, K/s, measured over <see cref="RateWindow"/>; null disables it.</summary>
    public double? MaxRateKPerS { get; set; }

    /// <summary>The interval over which the rate of change is measured.</summary>
    /// <value>Default 1 s.</value>
    public TimeSpan RateWindow { get; set; } = TimeSpan.FromSeconds(1);

    /// <summary>No sample for longer than this while a run is active raises the stale alarm; null disables it.</summary>
    /// <value>Default 30 s.</value>
    public TimeSpan? StaleAfter { get; set; } = TimeSpan.FromSeconds(30);

    /// <summary>A reading that stays within <see cref="FlatlineEpsilonK"/> this long during a run is a stuck sensor; null disables it.</summary>
    /// <value>Default 5 min.</value>
    public TimeSpan? FlatlineWindow { get; set; } = TimeSpan.FromMinutes(5);

    /// <summary>Largest variation that still counts as "no variation" for the flatline check, K.</summary>
    /// <value>Default 0.01 K.</value>
    public double FlatlineEpsilonK { get; set; } = 0.01;

    /// <summary>Samples further apart than this are not integrated into an excursion's effect on L (the gap policy).</summary>
    /// <value>Default 10 s.</value>
    public TimeSpan MaxGap { get; set; } = TimeSpan.FromSeconds(10);

    /// <summary>When deviation alarms may be raised (state-based alarming); see <see cref="DeviationAlarmRule"/>.</summary>
    /// <value>Default <see cref="DeviationAlarmRule.HoldAndGrowth"/>: no deviation alarm while heating or cooling towards a new setpoint.</value>
    public DeviationAlarmRule DeviationAlarming { get; set; } = DeviationAlarmRule.HoldAndGrowth;

    /// <summary>A setpoint move larger than this (from the last setpoint a ramp started at) starts a ramp, K.</summary>
    /// <value>Default 0.5 K.</value>
    public double SetpointChangeK { get; set; } = 0.5;

    /// <summary>Longest a ramp may last after the setpoint last moved before deviation alarms apply anyway; null: no limit.</summary>
    /// <value>Default 30 min.</value>
    public TimeSpan? RampTimeout { get; set; } = TimeSpan.FromMinutes(30);

    /// <summary>Returns the problems with these options; empty when valid.</summary>
    public IReadOnlyList<string> Validate()
    {
        var errors = new List<string>();
        if (!(WarningBandK > 0) || !double.IsFinite(WarningBandK))
        {
            errors.Add($"WarningBandK must be positive (got {WarningBandK}).");
        }
        if (!(AlarmBandK >= WarningBandK) || !double.IsFinite(AlarmBandK))
        {
            errors.Add($"AlarmBandK must be at least WarningBandK (got {AlarmBandK} < {WarningBandK}).");
        }
        if (!(HysteresisK >= 0) || !(HysteresisK < WarningBandK))
        {
            errors.Add($"HysteresisK must be in [0, WarningBandK) (got {HysteresisK}).");
        }
        if (MinimumDuration < TimeSpan.Zero)
        {
            errors.Add("MinimumDuration must not be negative.");
        }
        if (HighLimitC is { } high && LowLimitC is { } low && !(high > low))
        {
            errors.Add($"HighLimitC must be above LowLimitC (got {high} ≤ {low}).");
        }
        if (HighLimitC is { } h && !double.IsFinite(h))
        {
            errors.Add("HighLimitC must be finite.");
        }
        if (LowLimitC is { } l && !double.IsFinite(l))
        {
            errors.Add("LowLimitC must be finite.");
        }
        if (MaxRateKPerS is { } rate && !(rate > 0))
        {
            errors.Add($"MaxRateKPerS must be positive (got {rate}).");
        }
        if (RateWindow <= TimeSpan.Zero)
        {
            errors.Add("RateWindow must be positive.");
        }
        if (StaleAfter is { } stale && stale <= TimeSpan.Zero)
        {
            errors.Add("StaleAfter must be positive.");
        }
        if (FlatlineWindow is { } flat && flat <= TimeSpan.Zero)
        {
            errors.Add("FlatlineWindow must be positive.");
        }
        if (!(FlatlineEpsilonK >= 0))
        {
            errors.Add($"FlatlineEpsilonK must not be negative (got {FlatlineEpsilonK}).");
        }
        if (!(SetpointChangeK > 0) || !double.IsFinite(SetpointChangeK))
        {
            errors.Add($"SetpointChangeK must be positive (got {SetpointChangeK}).");
        }
        if (RampTimeout is { } ramp && ramp <= TimeSpan.Zero)
        {
            errors.Add("RampTimeout must be positive.");
        }
        if (!Enum.IsDefined(DeviationAlarming))
        {
            errors.Add($"DeviationAlarming must be Always or HoldAndGrowth (got {DeviationAlarming}).");
        }
        if (MaxGap <= TimeSpan.Zero)
        {
            errors.Add("MaxGap must be positive.");
        }
        return errors;
    }
}
