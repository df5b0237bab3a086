namespace RunWatch.Core.Thermal;

/// <summary>
/// The recorded history of one temperature channel: irregularly sampled (time, reading) pairs with
/// non-decreasing times in seconds from <see cref="Origin"/>. Readings are instrument values in °C, before
/// calibration. Equal consecutive times are allowed (a step). Immutable.
/// </summary>
public sealed class ThermalRecord
{
    private readonly double[] _timesS;
    private readonly double[] _readingsC;

    /// <summary>Creates a record; the arrays are copied.</summary>
    /// <exception cref="ArgumentException">Lengths differ, a value is not finite, or times decrease.</exception>
    public ThermalRecord(string channel, ReadOnlySpan<double> timesS, ReadOnlySpan<double> readingsC, DateTimeOffset? origin = null)
    {
        ArgumentNullException.ThrowIfNull(channel);
        if (timesS.Length != readingsC.Length)
        {
            throw new ArgumentException($"{timesS.Length} times but {readingsC.Length} readings.", nameof(readingsC));
        }
        for (int i = 0; i < timesS.Length; i++)
        {
            if (!double.IsFinite(timesS[i]) || !double.IsFinite(readingsC[i]))
            {
                throw new ArgumentException($"Sample {i} is not finite.", nameof(timesS));
            }
            if (i > 0 && timesS[i] < timesS[i - 1])
            {
                throw new ArgumentException($"Time goes backwards at sample {i} ({timesS[i]} s after {timesS[i - 1]} s).", nameof(timesS));
            }
        }
        Channel = channel;
        Origin = origin;
        _timesS = timesS.ToArray();
        _readingsC = readingsC.ToArray();
    }

    /// <summary>The channel name, e.g. <c>substrate_tc</c>.</summary>
    public string Channel { get; }

    /// <summary>The wall-clock instant of time 0, when known.</summary>
    public DateTimeOffset? Origin { get; }

    /// <summary>Number of samples.</summary>
    public int Count => _timesS.Length;

    /// <summary>Sample times in seconds from <see cref="Origin"/>, non-decreasing.</summary>
    public ReadOnlySpan<double> TimesS => _timesS;

    /// <summary>Instrument readings in °C.</summary>
    public ReadOnlySpan<double> ReadingsC => _readingsC;
}
