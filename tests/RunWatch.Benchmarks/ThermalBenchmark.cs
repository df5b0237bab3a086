using System.Diagnostics;
using System.Globalization;
using RunWatch.Core.Excursions;
using RunWatch.Core.Thermal;

namespace RunWatch.Benchmarks;

/// <summary>
/// L_eff integral and excursion monitor over 24 h of a 10 Hz channel (864,000 samples, invented profile).
/// Peers in the same run: a naive LINQ trapezoid with Math.Exp per sample for the integral, and a bare band-check
/// loop for the monitor. Targets: ≥ 50 M samples/s (integral), ≥ 10 M samples/s (monitor), 0 bytes per sample.
/// </summary>
internal sealed class ThermalBenchmark : IBenchmark
{
    private const int Samples = 24 * 3600 * 10;
    private const double SetpointC = 610;

    public string Name => "thermal";

    public string Description => "L_eff integral and excursion monitor, 24 h at 10 Hz (864,000 samples)";

    public int Run(bool quick, TextWriter output)
    {
        int repetitions = quick ? 5 : 30;
        var (times, readings) = Profile();
        var d = new ArrheniusDiffusivity(1e-3, 1.0);
        var calibration = TemperatureCalibration.FromReference(560, 580);
        double end = times[^1];

        double integral = 0;
        Measurement fast = Measure(repetitions, () => integral = ThermalIntegrator.Integrate(times, readings, calibration, d, 0, end, 10).IntegralCmSq);
        double naiveValue = 0;
        Measurement naive = Measure(Math.Max(2, repetitions / 3), () => naiveValue = NaiveTrapezoid(times, readings, calibration, d));
        double expSum = 0;
        Measurement expOnly = Measure(repetitions, () => expSum = ExpOnly(readings, d.ActivationTemperatureK));
        Report(output, "integral (segment rule)", fast);
        Report(output, "floor: one Math.Exp per sample", expOnly);
        Report(output, "integral peer: LINQ trapezoid", naive);
        output.WriteLine($"   ratio integral / LINQ peer: {(naive.BestNs / fast.BestNs).ToString("0.0", CultureInfo.InvariantCulture)}x faster; L_eff {F(DiffusionLength.LengthUm(integral, 1))} µm vs peer {F(DiffusionLength.LengthUm(naiveValue, 1))} µm (c = 1)");

        var options = new ExcursionOptions { MaxRateKPerS = 5, HighLimitC = 660, FlatlineWindow = TimeSpan.FromMinutes(5) };
        var counter = new Counter();
        // Monitors are built before timing so the figures count only per-sample work.
        var monitors = new Queue<ExcursionMonitor>(Enumerable.Range(0, repetitions + 2).Select(_ => new ExcursionMonitor(options, d, counter)));
        Measurement engine = Measure(repetitions, () =>
        {
            ExcursionMonitor monitor = monitors.Dequeue();
            monitor.BeginRun(0);
            for (int i = 0; i < times.Length; i++)
            {
                monitor.Observe(times[i], readings[i], SetpointC);
                if (i % 10 == 0)
                {
                    monitor.Tick(times[i]);
                }
            }
            monitor.EndRun(end);
        });
        int bare = 0;
        Measurement bareLoop = Measure(repetitions, () => bare = BareBandCheck(readings, options.WarningBandK));
        Report(output, "excursion monitor", engine);
        Report(output, "monitor peer: bare band check", bareLoop);
        output.WriteLine($"   ratio monitor / bare loop: {(engine.BestNs / bareLoop.BestNs).ToString("0.0", CultureInfo.InvariantCulture)}x the time; " +
            $"{counter.Excursions / (repetitions + 2)} excursions and {counter.Transitions / (repetitions + 2)} alarm transitions per pass ({bare} samples outside the band)");
        output.WriteLine($"   targets: integral ≥ 50 M/s: {(fast.SamplesPerS >= 50e6 ? "met" : "NOT met")}; monitor ≥ 10 M/s: {(engine.SamplesPerS >= 10e6 ? "met" : "NOT met")}; " +
            $"no allocation per sample (< 1 B per 1000 samples; what remains is per pass, from the runtime): {(fast.BytesPerSample < 1e-3 && engine.BytesPerSample < 1e-3 ? "met" : "NOT met")}");
        output.WriteLine("   (figures use thread CPU time, i.e. one core's work; wall time on a shared machine also counts other processes)");
        return 0;
    }

    // 24 h at 10 Hz: slow drift, a few growth-like plateaus, sensor noise, a handful of over-temperature bumps (invented).
    private static (double[] Times, double[] Readings) Profile()
    {
        var random = new Random(2026);
        var times = new double[Samples];
        var readings = new double[Samples];
        for (int i = 0; i < Samples; i++)
        {
            double t = i * 0.1;
            double bump = (t % 7200) is > 3000 and < 3120 ? 14 * Math.Sin(Math.PI * ((t % 7200) - 3000) / 120) : 0;
            times[i] = t;
            readings[i] = SetpointC + 1.5 * Math.Sin(t / 900) + bump + 0.2 * (random.NextDouble() - 0.5);
        }
        return (times, readings);
    }

    private static double NaiveTrapezoid(double[] times, double[] readings, TemperatureCalibration calibration, ArrheniusDiffusivity d) =>
        Enumerable.Range(1, times.Length - 1).Sum(i =>
            0.5 * (d.DiffusivityCmSqPerS(calibration.ToTrueC(readings[i - 1]) + 273.15) + d.DiffusivityCmSqPerS(calibration.ToTrueC(readings[i]) + 273.15))
            * (times[i] - times[i - 1]));

    private static double ExpOnly(double[] readings, double activationK)
    {
        double sum = 0;
        for (int i = 0; i < readings.Length; i++)
        {
            sum += Math.Exp(-activationK / (readings[i] + 273.15));
        }
        return sum;
    }

    private static int BareBandCheck(double[] readings, double band)
    {
        int outside = 0;
        for (int i = 0; i < readings.Length; i++)
        {
            outside += Math.Abs(readings[i] - SetpointC) > band ? 1 : 0;
        }
        return outside;
    }

    private static Measurement Measure(int repetitions, Action body)
    {
        body(); // warm up: JIT and tiered compilation
        body();
        var wall = new List<double>();
        var cpu = new List<double>();
        long allocated = 0;
        for (int r = 0; r < repetitions; r++)
        {
            long before = GC.GetAllocatedBytesForCurrentThread();
            double cpuStart = ThreadCpuClock.NowNs();
            long start = Stopwatch.GetTimestamp();
            body();
            long stop = Stopwatch.GetTimestamp();
            double cpuStop = ThreadCpuClock.NowNs();
            allocated += GC.GetAllocatedBytesForCurrentThread() - before;
            wall.Add((stop - start) * 1e9 / Stopwatch.Frequency);
            cpu.Add(cpuStop - cpuStart);
        }
        wall.Sort();
        cpu.Sort();
        return new Measurement(wall[0], wall[wall.Count / 2], cpu[0], allocated / (double)repetitions / Samples);
    }

    private static void Report(TextWriter output, string label, Measurement m) =>
        output.WriteLine(
            $"   {label,-32} {F(m.NsPerSample)} ns/sample ({F(m.SamplesPerS / 1e6)} M samples/s) on thread CPU time; " +
            $"wall best {F(m.BestWallNs / Samples)}, median {F(m.MedianWallNs / Samples)} ns/sample; {F(m.BytesPerSample)} B/sample allocated ({F(m.BytesPerSample * Samples)} B per pass)");

    private static string F(double value) => value.ToString("0.###", CultureInfo.InvariantCulture);

    // Figures use the best thread CPU time (falling back to wall time where that clock is missing).
    private readonly record struct Measurement(double BestWallNs, double MedianWallNs, double BestCpuNs, double BytesPerSample)
    {
        public double BestNs => double.IsNaN(BestCpuNs) ? BestWallNs : BestCpuNs;

        public double NsPerSample => BestNs / Samples;

        public double SamplesPerS => Samples / (BestNs * 1e-9);
    }

    private sealed class Counter : IExcursionObserver
    {
        public int Transitions { get; private set; }

        public int Excursions { get; private set; }

        public void OnAlarmChanged(in AlarmTransition transition) => Transitions++;

        public void OnExcursionEnded(in ExcursionSummary summary) => Excursions++;
    }
}
