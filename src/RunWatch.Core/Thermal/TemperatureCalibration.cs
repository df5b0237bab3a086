namespace RunWatch.Core.Thermal;

/// <summary>
/// Maps an instrument reading to the true substrate temperature, piecewise linear through reference points.
/// No point: identity. One point: a constant offset (true − reading) over the whole range. Two or more: linear
/// between neighbouring points, and beyond the outermost points the end segments are extended.
/// Immutable and thread-safe.
/// </summary>
public sealed class TemperatureCalibration
{
    private readonly double[] _readingsC;
    private readonly double[] _trueC;
    private readonly double _offsetK;

    /// <summary>Creates a calibration through <paramref name="points"/> (any order; readings must differ).</summary>
    /// <exception cref="ArgumentException">A value is not finite or two points share a reading.</exception>
    public TemperatureCalibration(IEnumerable<CalibrationPoint> points)
    {
        ArgumentNullException.ThrowIfNull(points);
        var sorted = points.OrderBy(p => p.ReadingC).ToArray();
        for (int i = 0; i < sorted.Length; i++)
        {
            if (!double.IsFinite(sorted[i].ReadingC) || !double.IsFinite(sorted[i].TrueC))
            {
                throw new ArgumentException($"Calibration point {i + 1} is not a finite pair of temperatures.", nameof(points));
            }
            if (i > 0 && sorted[i].ReadingC == sorted[i - 1].ReadingC)
            {
                throw new ArgumentException($"Two calibration points share the reading {sorted[i].ReadingC} °C.", nameof(points));
            }
        }
        Points = sorted;
        _readingsC = sorted.Select(p => p.ReadingC).ToArray();
        _trueC = sorted.Select(p => p.TrueC).ToArray();
        _offsetK = sorted.Length == 1 ? sorted[0].TrueC - sorted[0].ReadingC : 0;
    }

    /// <summary>The identity calibration (reading = true temperature).</summary>
    public static TemperatureCalibration Identity { get; } = new([]);

    /// <summary>A one-point calibration: <paramref name="readingC"/> observed where the truth is <paramref name="trueC"/>.</summary>
    public static TemperatureCalibration FromReference(double readingC, double trueC) => new([new CalibrationPoint(readingC, trueC)]);

    /// <summary>The reference points, sorted by reading.</summary>
    public IReadOnlyList<CalibrationPoint> Points { get; }

    /// <summary>True when this calibration changes nothing.</summary>
    public bool IsIdentity => _readingsC.Length == 0;

    /// <summary>True when the calibration is one constant offset (no point or one point); gives that offset in K.</summary>
    internal bool TryGetOffsetK(out double offsetK)
    {
        offsetK = _offsetK;
        return _readingsC.Length < 2;
    }

    /// <summary>The true temperature in °C for an instrument reading in °C.</summary>
    public double ToTrueC(double readingC)
    {
        double[] x = _readingsC;
        if (x.Length < 2)
        {
            return readingC + _offsetK;
        }
        // Few points in practice: a linear scan beats a binary search and extends the end segments for free.
        int i = 1;
        while (i < x.Length - 1 && readingC > x[i])
        {
            i++;
        }
        double[] y = _trueC;
        return y[i - 1] + (readingC - x[i - 1]) * (y[i] - y[i - 1]) / (x[i] - x[i - 1]);
    }

    /// <summary>Applies the calibration to every reading.</summary>
    public void ToTrueC(ReadOnlySpan<double> readingsC, Span<double> trueC)
    {
        if (trueC.Length < readingsC.Length)
        {
            throw new ArgumentException("The destination is shorter than the readings.", nameof(trueC));
        }
        for (int i = 0; i < readingsC.Length; i++)
        {
            trueC[i] = ToTrueC(readingsC[i]);
        }
    }
}
