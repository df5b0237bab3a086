namespace RunWatch.Core.Tests.Thermal;

/// <summary>Sampled temperature histories for tests (times in s, readings in °C).</summary>
internal static class ThermalProfiles
{
    public static (double[] Times, double[] Readings) Sample(double startS, double endS, double stepS, Func<double, double> celsiusAt)
    {
        int n = (int)Math.Round((endS - startS) / stepS) + 1;
        var times = new double[n];
        var readings = new double[n];
        for (int i = 0; i < n; i++)
        {
            times[i] = i == n - 1 ? endS : startS + i * stepS;
            readings[i] = celsiusAt(times[i]);
        }
        return (times, readings);
    }

    /// <summary>Irregular sampling: steps drawn uniformly in [minStep, maxStep] from a seeded generator.</summary>
    public static (double[] Times, double[] Readings) SampleIrregular(double startS, double endS, double minStepS, double maxStepS, int seed, Func<double, double> celsiusAt)
    {
        var random = new Random(seed);
        var times = new List<double> { startS };
        while (times[^1] < endS)
        {
            times.Add(Math.Min(endS, times[^1] + minStepS + (maxStepS - minStepS) * random.NextDouble()));
        }
        double[] t = times.ToArray();
        return (t, t.Select(celsiusAt).ToArray());
    }
}
