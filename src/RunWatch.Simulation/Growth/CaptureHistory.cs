namespace RunWatch.Simulation.Growth;

/// <summary>
/// A substrate temperature history turned into capture lengths: sample k holds from its time to the next sample's
/// (the last one holds for the median interval). Built once per run; a lookup is a binary search.
/// </summary>
public sealed class CaptureHistory
{
    private readonly double[] _times;
    private readonly double[] _lambdas;

    /// <summary>From samples on one time axis (s, increasing) and true substrate temperatures (°C).</summary>
    /// <exception cref="ArgumentException">Fewer than two samples, a non-increasing axis or a non-finite value.</exception>
    public CaptureHistory(ReadOnlySpan<double> timesS, ReadOnlySpan<double> temperaturesC, AdatomPhysics physics)
    {
        ArgumentNullException.ThrowIfNull(physics);
        if (timesS.Length < 2 || timesS.Length != temperaturesC.Length)
        {
            throw new ArgumentException("a history needs two or more samples, one temperature per time");
        }
        _times = timesS.ToArray();
        double peak = double.NegativeInfinity;
        _lambdas = new double[timesS.Length];
        var steps = new double[timesS.Length - 1];
        for (int k = 0; k < _times.Length; k++)
        {
            if (!double.IsFinite(_times[k]) || !double.IsFinite(temperaturesC[k]) || (k > 0 && !(_times[k] > _times[k - 1])))
            {
                throw new ArgumentException($"sample {k}: times must increase and every value be finite");
            }
            _lambdas[k] = physics.CaptureLengthUm(temperaturesC[k]);
            peak = Math.Max(peak, temperaturesC[k]);
            if (k > 0)
            {
                steps[k - 1] = _times[k] - _times[k - 1];
            }
        }
        Array.Sort(steps);
        PeakTemperatureC = peak;
        StartS = _times[0];
        EndS = _times[^1] + steps[steps.Length / 2];
    }

    /// <summary>Highest temperature of the history (°C).</summary>
    public double PeakTemperatureC { get; }

    /// <summary>Start of the history (s).</summary>
    public double StartS { get; }

    /// <summary>End of the history: the last sample plus the median interval (s).</summary>
    public double EndS { get; }

    /// <summary>Length of the history (s).</summary>
    public double DurationS => EndS - StartS;

    /// <summary>λ (µm) in force at <paramref name="timeS"/>.</summary>
    public double CaptureLengthAt(double timeS)
    {
        int k = Array.BinarySearch(_times, timeS);
        k = k >= 0 ? k : Math.Max(~k - 1, 0);
        return _lambdas[k];
    }

    /// <summary>Time-weighted mean of λ (µm), for reports of the truth.</summary>
    public double MeanCaptureLengthUm()
    {
        double sum = 0;
        for (int k = 0; k < _times.Length; k++)
        {
            double next = k + 1 < _times.Length ? _times[k + 1] : EndS;
            sum += _lambdas[k] * (next - _times[k]);
        }
        return sum / DurationS;
    }
}
