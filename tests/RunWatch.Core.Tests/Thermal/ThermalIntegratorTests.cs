using RunWatch.Core.Thermal;
using Xunit;

namespace RunWatch.Core.Tests.Thermal;

public sealed class ThermalIntegratorTests
{
    private static readonly ArrheniusDiffusivity OneEv = new(1.0, 1.0);

    private static IntegrationResult Integrate(double[] times, double[] readings, ArrheniusDiffusivity d, double start, double end, double maxGapS = 10, List<RecordGap>? gaps = null) =>
        ThermalIntegrator.Integrate(times, readings, TemperatureCalibration.Identity, d, start, end, maxGapS, gaps);

    [Fact]
    public void Integrate_IsothermalIrregularRecord_EqualsDTimesDuration()
    {
        // DERIVED: constant T gives ∫D dt = D(T)·t exactly.
        var (t, r) = ThermalProfiles.SampleIrregular(0, 1800, 0.05, 2.0, seed: 7, _ => 610.0);
        var d = new ArrheniusDiffusivity(2.5e-3, 1.3);
        IntegrationResult result = Integrate(t, r, d, 0, 1800);
        double expected = d.DiffusivityCmSqPerS(610 + 273.15) * 1800;
        Assert.True(Math.Abs(result.IntegralCmSq / expected - 1) < 1e-12, $"{result.IntegralCmSq} vs {expected}");
        Assert.Equal(100.0, result.CoveragePercent, 1e-9);
        Assert.True(result.IsComplete);
    }

    [Fact]
    public void Integrate_WorkedRampValue_MatchesChecksTable()
    {
        // DERIVED / COMPUTED HERE (CHECKS §8): Ea = 1 eV, T0 = 800 K, β = 0.5 K/s, t = 600 s → 4.597167246591e-3 s.
        // That value was computed with kB rounded to 8.617333262e-5 eV/K (mpmath at 30 digits reproduces it only so),
        // so the test sets Ea/kB = 1/8.617333262e-5 K to match its inputs.
        var rounded = new ArrheniusDiffusivity(1.0, PhysicalConstants.BoltzmannEvPerK / 8.617333262e-5);
        var (t, r) = ThermalProfiles.Sample(0, 600, 1.0, s => 800 - 273.15 + 0.5 * s);
        Assert.Equal(4.597167246591e-3, Integrate(t, r, rounded, 0, 600).IntegralCmSq, 4.6e-3 * 1e-12);
        // COMPUTED HERE: the same integral with the exact kB, mpmath quad at 30 digits: 4.59716724747166553e-3 s.
        Assert.Equal(4.59716724747166553e-3, Integrate(t, r, OneEv, 0, 600).IntegralCmSq, 4.6e-3 * 1e-12);
    }

    [Theory]
    [InlineData(1.0, 800.0, 0.5, 600.0, 1.0)]
    [InlineData(1.0, 800.0, 0.5, 600.0, 10.0)]
    [InlineData(2.5, 850.0, 0.1, 1800.0, 2.0)]
    [InlineData(0.6, 700.0, 2.0, 120.0, 0.5)]
    [InlineData(1.8, 920.0, -0.25, 900.0, 3.0)]
    [InlineData(3.0, 780.0, 1.0, 240.0, 5.0)]
    public void Integrate_LinearRamp_MatchesE1ClosedFormFromMathNet(double eaEv, double startK, double rateKPerS, double durationS, double stepS)
    {
        // Reference: closed form in E1 (DERIVED, CHECKS §8) with MathNet.Numerics SpecialFunctions.ExponentialIntegral.
        var d = new ArrheniusDiffusivity(1.0, eaEv);
        var (t, r) = ThermalProfiles.Sample(0, durationS, stepS, s => startK - 273.15 + rateKPerS * s);
        double expected = RampReference.Integral(startK, rateKPerS, durationS, d.ActivationTemperatureK);
        double actual = Integrate(t, r, d, 0, durationS).IntegralCmSq;
        Assert.True(Math.Abs(actual / expected - 1) < 1e-6, $"{actual} vs {expected}, relative {actual / expected - 1}");
        // The segment rule is exact for a linear profile up to rounding, so the agreement is in fact far better.
        Assert.True(Math.Abs(actual / expected - 1) < 1e-9, $"relative {actual / expected - 1}");
    }

    [Fact]
    public void Integrate_RampsUpToLargeEaOverKT_MatchScipyQuadrature()
    {
        // Reference: SciPy (Debian python3-scipy) adaptive quadrature and the E1 closed form with scipy.special.exp1,
        // tests/reference/thermal_ramp.py. Ea/(kB·T) runs from about 7 to 200, where T·e^{−x} and a·E1(x) cancel.
        (double Ea, double T0, double Beta, double Duration)[] ramps =
        [
            (0.5, 820, 0.4, 600), (1.0, 800, 0.5, 600), (2.5, 870, -0.1, 1800), (6.0, 900, 1.0, 300), (13.78, 800, 0.5, 600),
        ];
        string[] args = ramps.SelectMany(r => new[] { r.Ea, r.T0, r.Beta, r.Duration }).Select(v => v.ToString("R", System.Globalization.CultureInfo.InvariantCulture)).ToArray();
        string[] lines = RunWatch.Testing.Reference.ReferencePython.Run("thermal_ramp.py", args).Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.Equal(ramps.Length, lines.Length);
        for (int i = 0; i < ramps.Length; i++)
        {
            var (ea, t0, beta, duration) = ramps[i];
            double[] reference = lines[i].Split(' ').Select(v => double.Parse(v, System.Globalization.CultureInfo.InvariantCulture)).ToArray();
            var (t, r) = ThermalProfiles.Sample(0, duration, 1.0, s => t0 - 273.15 + beta * s);
            double actual = Integrate(t, r, new ArrheniusDiffusivity(1, ea), 0, duration).IntegralCmSq;
            Assert.True(Math.Abs(actual / reference[0] - 1) < 1e-9, $"ramp {i}: {actual} vs quad {reference[0]}");
            Assert.True(Math.Abs(actual / reference[1] - 1) < 1e-9, $"ramp {i}: {actual} vs closed form {reference[1]}");
        }
    }

    [Theory]
    [InlineData(1.0, 300.0)]
    [InlineData(2.0, 150.0)]
    [InlineData(3.0, -200.0)]
    public void SegmentIntegralS_OneLargeStep_UsesClosedForm(double eaEv, double deltaK)
    {
        // Reference: MathNet E1 closed form; a single 300 K step is far outside the fast rule's range.
        double a = eaEv / PhysicalConstants.BoltzmannEvPerK;
        double expected = RampReference.Integral(800, deltaK / 60, 60, a);
        double actual = ThermalIntegrator.SegmentIntegralS(60, 800, 800 + deltaK, a);
        Assert.True(Math.Abs(actual / expected - 1) < 1e-10, $"{actual} vs {expected}");
    }

    [Fact]
    public void SegmentIntegralS_RandomSmallSteps_AgreesWithClosedForm()
    {
        // Reference: MathNet E1 closed form over seeded random segments covering the fast rule's range and beyond.
        var random = new Random(42);
        for (int i = 0; i < 2000; i++)
        {
            double a = (0.5 + 2.5 * random.NextDouble()) / PhysicalConstants.BoltzmannEvPerK;
            double startK = 600 + 400 * random.NextDouble();
            double deltaK = (random.NextDouble() - 0.5) * (i % 2 == 0 ? 2 : 40);
            if (Math.Abs(deltaK) < 0.05)
            {
                continue; // the closed-form reference itself cancels badly for tiny steps
            }
            double expected = RampReference.Integral(startK, deltaK, 1, a);
            double actual = ThermalIntegrator.SegmentIntegralS(1, startK, startK + deltaK, a);
            Assert.True(Math.Abs(actual / expected - 1) < 1e-9, $"a={a} T0={startK} ΔT={deltaK}: {actual} vs {expected}");
        }
    }

    [Fact]
    public void SegmentIntegralS_NegativeActivation_MatchesQuadrature()
    {
        // Reference: MathNet.Numerics Integrate (adaptive Gauss-Kronrod) of exp(−a/T(t)) for a < 0 (a lifetime product).
        double a = -0.4 / PhysicalConstants.BoltzmannEvPerK;
        double expected = MathNet.Numerics.Integrate.GaussKronrod(s => Math.Exp(-a / (700 + 5 * s)), 0, 30, 1e-14);
        double actual = ThermalIntegrator.SegmentIntegralS(30, 700, 850, a);
        Assert.True(Math.Abs(actual / expected - 1) < 1e-9, $"{actual} vs {expected}");
    }

    [Fact]
    public void Integrate_SmoothProfileRefinedTenfold_ChangesLengthByLessThan1e4()
    {
        // Requirement of the integration rule: refining the sampling of a smooth profile changes L by < 1e-4 relative.
        static double Profile(double s) => 600 + 25 * Math.Sin(2 * Math.PI * s / 400) + 0.01 * s;
        var d = new ArrheniusDiffusivity(1e-2, 1.5);
        var (tc, rc) = ThermalProfiles.Sample(0, 1800, 5.0, Profile);
        var (tf, rf) = ThermalProfiles.Sample(0, 1800, 0.5, Profile);
        double coarse = DiffusionLength.LengthUm(Integrate(tc, rc, d, 0, 1800).IntegralCmSq, 1);
        double fine = DiffusionLength.LengthUm(Integrate(tf, rf, d, 0, 1800).IntegralCmSq, 1);
        double relative = Math.Abs(coarse / fine - 1);
        Assert.True(relative < 1e-4, $"coarse {coarse} µm, fine {fine} µm, relative {relative}");
        Assert.True(relative > 0, "the two samplings should differ at all, or the test checks nothing");
    }

    [Fact]
    public void Integrate_PiecewiseConstantHistory_IsSumOfDTimesDtInAnyOrder()
    {
        // DERIVED (CHECKS §8): a piecewise-constant history gives L² = Σ D(T_i)·Δt_i, independent of the order.
        double[] plateausC = [590, 612, 605, 620];
        double[] durationsS = [100, 250, 40, 310];
        var d = new ArrheniusDiffusivity(3e-3, 1.2);
        double expected = 0;
        for (int i = 0; i < plateausC.Length; i++)
        {
            expected += d.DiffusivityCmSqPerS(plateausC[i] + 273.15) * durationsS[i];
        }
        foreach (int[] order in new[] { new[] { 0, 1, 2, 3 }, new[] { 3, 1, 0, 2 } })
        {
            var (t, r) = Steps(order.Select(i => (plateausC[i], durationsS[i])));
            double actual = Integrate(t, r, d, 0, durationsS.Sum(), maxGapS: 1000).IntegralCmSq;
            Assert.True(Math.Abs(actual / expected - 1) < 1e-12, $"{actual} vs {expected}");
        }
    }

    [Fact]
    public void Integrate_AddingTimeAtExcursionTemperature_AddsExactlyDTimesDtToLSquared()
    {
        // DERIVED (CHECKS §8): inserting Δt at T_exc adds exactly D(T_exc)·Δt to L² (c = 1).
        var d = new ArrheniusDiffusivity(3e-3, 1.2);
        var (t0, r0) = Steps([(610, 600), (610, 600)]);
        var (t1, r1) = Steps([(610, 600), (640, 45), (610, 600)]);
        double before = Integrate(t0, r0, d, 0, 1200, maxGapS: 1000).IntegralCmSq;
        double after = Integrate(t1, r1, d, 0, 1245, maxGapS: 1000).IntegralCmSq;
        double added = d.DiffusivityCmSqPerS(640 + 273.15) * 45;
        Assert.True(Math.Abs((after - before) / added - 1) < 1e-10, $"{after - before} vs {added}");
    }

    [Fact]
    public void Integrate_GapLongerThanLimit_IsReportedAndNotIntegrated()
    {
        double[] t = [0, 1, 2, 3, 40, 41, 42];
        double[] r = [600, 600, 600, 600, 600, 600, 600];
        var gaps = new List<RecordGap>();
        IntegrationResult result = Integrate(t, r, OneEv, 0, 42, maxGapS: 10, gaps);
        Assert.False(result.IsComplete);
        Assert.Equal(1, result.GapCount);
        Assert.Equal(new RecordGap(3, 40), Assert.Single(gaps));
        Assert.Equal(5.0, result.CoveredS, 1e-12);
        Assert.Equal(100.0 * 5 / 42, result.CoveragePercent, 1e-9);
        Assert.Equal(OneEv.DiffusivityCmSqPerS(873.15) * 5, result.IntegralCmSq, 1e-25);
    }

    [Fact]
    public void Integrate_GapWithinLimit_IsIntegratedAcross()
    {
        double[] t = [0, 8, 16];
        double[] r = [600, 600, 600];
        IntegrationResult result = Integrate(t, r, OneEv, 0, 16, maxGapS: 10);
        Assert.True(result.IsComplete);
        Assert.Equal(100.0, result.CoveragePercent, 1e-12);
    }

    [Fact]
    public void Integrate_RecordStartsLateAndEndsEarly_ReportsBothEnds()
    {
        double[] t = [20, 21, 22, 80];
        double[] r = [600, 600, 600, 600];
        var gaps = new List<RecordGap>();
        IntegrationResult result = Integrate(t, r, OneEv, 0, 100, maxGapS: 10, gaps);
        Assert.Equal([new RecordGap(0, 20), new RecordGap(22, 80), new RecordGap(80, 100)], gaps);
        Assert.Equal(2.0, result.CoveredS, 1e-12);
    }

    [Fact]
    public void Integrate_WindowInsideRecord_ClipsSegmentsOnTheInterpolant()
    {
        // Reference: MathNet E1 closed form over the sub-window [13.3, 97.7] s of a 1 K/s ramp sampled every 2 s.
        var d = new ArrheniusDiffusivity(1, 1.4);
        var (t, r) = ThermalProfiles.Sample(0, 120, 2.0, s => 550 + s);
        double expected = RampReference.Integral(550 + 273.15 + 13.3, 1, 97.7 - 13.3, d.ActivationTemperatureK);
        IntegrationResult result = Integrate(t, r, d, 13.3, 97.7);
        Assert.True(Math.Abs(result.IntegralCmSq / expected - 1) < 1e-9, $"{result.IntegralCmSq} vs {expected}");
        Assert.Equal(97.7 - 13.3, result.CoveredS, 1e-9);
        Assert.True(result.IsComplete);
    }

    [Fact]
    public void Integrate_BadSamples_Throw()
    {
        Assert.Throws<ArgumentException>(() => Integrate([0, 2, 1, 3], [600, 600, 600, 600], OneEv, 0, 3));
        Assert.Throws<ArgumentException>(() => Integrate([0, 1, 2], [600, double.NaN, 600], OneEv, 0, 2));
        Assert.Throws<ArgumentException>(() => Integrate([0, 1, 2], [600, 600], OneEv, 0, 2));
    }

    [Fact]
    public void Integrate_EmptyRecord_IsOneGap()
    {
        var gaps = new List<RecordGap>();
        IntegrationResult result = Integrate([], [], OneEv, 0, 60, 10, gaps);
        Assert.Equal(0, result.IntegralCmSq);
        Assert.Equal(0, result.CoveragePercent);
        Assert.Equal(new RecordGap(0, 60), Assert.Single(gaps));
    }

    [Fact]
    public void Integrate_WithCalibration_UsesTrueTemperature()
    {
        // CONFIRMED (CHECKS §9): GaAs oxide desorption ≈ 580 °C; a reading of 560 °C there means +20 K over the log.
        var calibration = TemperatureCalibration.FromReference(560, 580);
        var (t, r) = ThermalProfiles.Sample(0, 300, 1.0, _ => 600.0);
        IntegrationResult result = ThermalIntegrator.Integrate(t, r, calibration, OneEv, 0, 300, 10);
        Assert.Equal(OneEv.DiffusivityCmSqPerS(620 + 273.15) * 300, result.IntegralCmSq, OneEv.DiffusivityCmSqPerS(893.15) * 300 * 1e-12);
    }

    [Fact]
    public void Integrate_NoisyTenHertzDay_MatchesPerSegmentReference()
    {
        // Optimised loop (exp recurrence, specialised calibration) against the plain per-segment rule with two exps
        // per segment, over a seeded noisy 10 Hz record with a 2-point calibration and a one-point calibration.
        var random = new Random(5);
        var (t, r) = ThermalProfiles.Sample(0, 86_400, 0.1, s => 610 + 3 * Math.Sin(s / 900) + 0.2 * (random.NextDouble() - 0.5) + (s % 7200 is > 3000 and < 3100 ? 12 : 0));
        var d = new ArrheniusDiffusivity(1e-3, 1.0);
        foreach (TemperatureCalibration calibration in new[]
        {
            TemperatureCalibration.FromReference(560, 580),
            new TemperatureCalibration([new CalibrationPoint(500, 505), new CalibrationPoint(650, 672)]),
        })
        {
            double reference = 0;
            for (int i = 1; i < t.Length; i++)
            {
                reference += ThermalIntegrator.SegmentIntegralS(t[i] - t[i - 1], calibration.ToTrueC(r[i - 1]) + 273.15, calibration.ToTrueC(r[i]) + 273.15, d.ActivationTemperatureK);
            }
            reference *= d.D0CmSqPerS;
            double actual = ThermalIntegrator.Integrate(t, r, calibration, d, 0, 86_400, 10).IntegralCmSq;
            Assert.True(Math.Abs(actual / reference - 1) < 1e-12, $"{actual} vs {reference}, relative {actual / reference - 1}");
        }
    }

    [Fact]
    public void Integrate_LongRecord_AllocatesNothing()
    {
        var (t, r) = ThermalProfiles.Sample(0, 10_000, 0.1, s => 600 + 5 * Math.Sin(s / 50));
        var d = new ArrheniusDiffusivity(1e-2, 1.5);
        Integrate(t, r, d, 0, 10_000); // warm up (JIT)
        long before = GC.GetAllocatedBytesForCurrentThread();
        IntegrationResult result = Integrate(t, r, d, 0, 10_000);
        long allocated = GC.GetAllocatedBytesForCurrentThread() - before;
        Assert.True(result.IntegralCmSq > 0);
        Assert.Equal(0, allocated);
    }

    private static (double[] Times, double[] Readings) Steps(IEnumerable<(double Celsius, double DurationS)> plateaus)
    {
        // Each plateau is two samples at the same temperature; a change between plateaus is a step at one instant.
        var times = new List<double>();
        var readings = new List<double>();
        double now = 0;
        foreach (var (celsius, duration) in plateaus)
        {
            times.Add(now);
            readings.Add(celsius);
            now += duration;
            times.Add(now);
            readings.Add(celsius);
        }
        return (times.ToArray(), readings.ToArray());
    }
}
