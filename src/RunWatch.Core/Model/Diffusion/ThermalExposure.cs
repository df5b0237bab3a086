using RunWatch.Core.Thermal;

namespace RunWatch.Core.Model.Diffusion;

/// <summary>
/// How long a wafer spent at each true substrate temperature during its growth window: the thermal history reduced
/// to (temperature, seconds) pairs, temperatures grouped in bins of <see cref="BinK"/> (each pair holds its bin's
/// time-weighted mean temperature). Any function of temperature integrates over the history as Σ f(T_b)·t_b.
/// </summary>
/// <remarks>
/// Between samples the temperature is the straight line joining them (as in docs/thermal.md); each segment is
/// integrated by the trapezoid rule, half its time to each end's temperature, after cutting it at the window's edges.
/// Segments longer than the gap limit are not integrated (<see cref="UncoveredS"/>). With 0.05 K bins the grouping
/// moves λ by far less than 0.1 % for any plausible E_λ.
/// </remarks>
public sealed class ThermalExposure
{
    /// <summary>Temperature bin width in kelvin.</summary>
    public const double BinK = 0.05;

    private readonly double[] _temperaturesK;
    private readonly double[] _seconds;

    private ThermalExposure(double[] temperaturesK, double[] seconds, double windowS, double uncoveredS)
    {
        _temperaturesK = temperaturesK;
        _seconds = seconds;
        WindowS = windowS;
        UncoveredS = uncoveredS;
        double total = 0, weighted = 0;
        for (int i = 0; i < seconds.Length; i++)
        {
            total += seconds[i];
            weighted += seconds[i] * temperaturesK[i];
        }
        CoveredS = total;
        MeanTemperatureK = total > 0 ? weighted / total : double.NaN;
    }

    /// <summary>Bin temperatures in kelvin (true substrate temperatures).</summary>
    public ReadOnlySpan<double> TemperaturesK => _temperaturesK;

    /// <summary>Seconds in each bin.</summary>
    public ReadOnlySpan<double> Seconds => _seconds;

    /// <summary>Length of the growth window.</summary>
    public double WindowS { get; }

    /// <summary>Seconds of the window integrated.</summary>
    public double CoveredS { get; }

    /// <summary>Seconds of the window left out (gaps longer than the limit, or before the first / after the last sample).</summary>
    public double UncoveredS { get; }

    /// <summary>Time-weighted mean temperature over the covered time, in kelvin.</summary>
    public double MeanTemperatureK { get; }

    /// <summary>A constant temperature held for <paramref name="seconds"/>.</summary>
    public static ThermalExposure Isothermal(double temperatureK, double seconds) => new([temperatureK], [seconds], seconds, 0);

    /// <summary>
    /// The exposure of <paramref name="record"/> over <paramref name="window"/> (seconds on the record's axis), readings
    /// mapped to true temperatures by <paramref name="calibration"/>. Where <paramref name="replaced"/> is given,
    /// samples inside those intervals read <paramref name="replacementC"/> instead (the history without an excursion).
    /// </summary>
    public static ThermalExposure FromRecord(ThermalRecord record, TemperatureCalibration calibration, GrowthWindow window,
        double maxGapS = 10, IReadOnlyList<GrowthWindow>? replaced = null, double replacementC = double.NaN)
    {
        ArgumentNullException.ThrowIfNull(record);
        ArgumentNullException.ThrowIfNull(calibration);
        if (!(window.EndS > window.StartS))
        {
            throw new ArgumentException($"The growth window must end after it starts ({window.StartS} to {window.EndS} s).", nameof(window));
        }
        ReadOnlySpan<double> t = record.TimesS;
        var trueK = new double[record.Count];
        for (int i = 0; i < trueK.Length; i++)
        {
            double reading = record.ReadingsC[i];
            if (replaced is not null)
            {
                foreach (GrowthWindow r in replaced)
                {
                    if (t[i] >= r.StartS && t[i] <= r.EndS)
                    {
                        reading = replacementC;
                    }
                }
            }
            trueK[i] = PhysicalConstants.CelsiusToKelvin(calibration.ToTrueC(reading));
        }
        var bins = new SortedDictionary<long, (double WeightedT, double Seconds)>();
        double covered = 0;
        for (int i = 1; i < trueK.Length; i++)
        {
            double t0 = t[i - 1], t1 = t[i];
            if (t1 <= window.StartS || t0 >= window.EndS || t1 <= t0 || t1 - t0 > maxGapS)
            {
                continue;
            }
            double a = Math.Max(t0, window.StartS), b = Math.Min(t1, window.EndS);
            double ta = trueK[i - 1] + ((trueK[i] - trueK[i - 1]) * (a - t0) / (t1 - t0));
            double tb = trueK[i - 1] + ((trueK[i] - trueK[i - 1]) * (b - t0) / (t1 - t0));
            Add(bins, ta, 0.5 * (b - a));
            Add(bins, tb, 0.5 * (b - a));
            covered += b - a;
        }
        var temps = new double[bins.Count];
        var secs = new double[bins.Count];
        int k = 0;
        foreach ((double weighted, double s) in bins.Values)
        {
            temps[k] = weighted / s;
            secs[k] = s;
            k++;
        }
        return new ThermalExposure(temps, secs, window.DurationS, window.DurationS - covered);
    }

    /// <summary>From explicit (temperature K, seconds) pairs.</summary>
    public static ThermalExposure FromPairs(ReadOnlySpan<double> temperaturesK, ReadOnlySpan<double> seconds)
    {
        if (temperaturesK.Length != seconds.Length || temperaturesK.Length == 0)
        {
            throw new ArgumentException("Need as many temperatures as durations, at least one.", nameof(seconds));
        }
        double total = 0;
        foreach (double s in seconds)
        {
            total += s;
        }
        return new ThermalExposure(temperaturesK.ToArray(), seconds.ToArray(), total, 0);
    }

    /// <summary>
    /// Fine-node weights of the whole history under <paramref name="law"/> into <paramref name="weights"/>
    /// (cleared first; length <see cref="CaptureAreaTable.FineCount"/>). Returns the seconds whose λ fell outside the table.
    /// </summary>
    public double Weights(CaptureLengthLaw law, CaptureAreaTable table, Span<double> weights)
    {
        ArgumentNullException.ThrowIfNull(law);
        ArgumentNullException.ThrowIfNull(table);
        weights[..table.FineCount].Clear();
        double outside = 0;
        for (int b = 0; b < _temperaturesK.Length; b++)
        {
            if (!table.AccumulateWeights(law.LambdaUm(_temperaturesK[b]), _seconds[b], weights))
            {
                outside += _seconds[b];
            }
        }
        return outside;
    }

    /// <summary>Smallest and largest λ (µm) the history reaches under <paramref name="law"/>.</summary>
    public (double Min, double Max) LambdaRange(CaptureLengthLaw law)
    {
        ArgumentNullException.ThrowIfNull(law);
        double min = double.PositiveInfinity, max = 0;
        foreach (double t in _temperaturesK)
        {
            double l = law.LambdaUm(t);
            min = Math.Min(min, l);
            max = Math.Max(max, l);
        }
        return (min, max);
    }

    private static void Add(SortedDictionary<long, (double WeightedT, double Seconds)> bins, double temperatureK, double seconds)
    {
        if (seconds <= 0)
        {
            return;
        }
        long key = (long)Math.Floor(temperatureK / BinK);
        bins.TryGetValue(key, out (double WeightedT, double Seconds) v);
        bins[key] = (v.WeightedT + (temperatureK * seconds), v.Seconds + seconds);
    }
}
