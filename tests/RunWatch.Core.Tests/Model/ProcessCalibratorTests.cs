using MathNet.Numerics.Distributions;
using RunWatch.Core.Geometry;
using RunWatch.Core.Model;
using RunWatch.Core.PointPatterns;
using Xunit;

namespace RunWatch.Core.Tests.Model;

public sealed class ProcessCalibratorTests
{
    private const double Ea = 1.1;
    private const double D0 = 7.8e-7;
    private const double DurationS = 1800;
    private const double C = 4;

    /// <summary>
    /// A synthetic wafer: Poisson wire sites (2.5 µm⁻²) on a 30 µm substrate, radii r = 60·Â(L)^0.5 + 1.5 nm noise
    /// from the zones on the whole substrate, L from the Arrhenius law at T (DERIVED: L² = c·D0·exp(−Ea/(kB·T))·t).
    /// The "SEM field" is the central 20 µm window: the search sees only its wires, as with a real image.
    /// </summary>
    internal static (WaferCalibrationInput Input, double TrueL) Wafer(string id, double temperatureK, int seed)
    {
        double d = D0 * Math.Exp(-Ea / (ArrheniusCalibration.BoltzmannEvPerK * temperatureK));
        double trueL = Math.Sqrt(C * d * DurationS) * 1e7;
        var substrate = CaptureField.Rectangle(30_000, 30_000);
        Point2D[] sites = NucleationSites.Poisson(substrate, 2.5e8 / 1e14, seed);
        CaptureZoneResult truth = CaptureZones.Compute(sites, substrate, new CaptureZoneOptions { DiffusionLength = trueL });
        var noise = new Normal(0, 1.5, new Random(seed));
        var seen = new List<Point2D>();
        var radii = new List<double>();
        for (int i = 0; i < sites.Length; i++)
        {
            Point2D p = sites[i];
            if (p.X > 5000 && p.X < 25_000 && p.Y > 5000 && p.Y < 25_000)
            {
                seen.Add(new Point2D(p.X - 5000, p.Y - 5000));
                double a = truth.Areas[i] / (Math.PI * trueL * trueL);
                radii.Add((60 * Math.Sqrt(a)) + noise.Sample());
            }
        }
        CaptureAreaEvaluator evaluator = MeasuredCaptureAreas.ForFields([new MeasuredField(CaptureField.Rectangle(20_000, 20_000), seen.ToArray())]);
        return (new WaferCalibrationInput(id, radii.ToArray(), evaluator, DurationS, temperatureK, C), trueL);
    }

    [Fact]
    public void Calibrate_ThreeWafersAtThreeTemperatures_RecoversLAndEaAndSelectsPowerLaw()
    {
        var wafers = new[] { Wafer("W-A", 853.15, 1), Wafer("W-B", 873.15, 2), Wafer("W-C", 893.15, 3) };
        CalibrationRecord record = ProcessCalibrator.Calibrate("cand-1", "nw-gaas-std", DateTimeOffset.UnixEpoch, wafers.Select(w => w.Input).ToArray());

        for (int i = 0; i < wafers.Length; i++)
        {
            Assert.InRange(record.CaptureRadii[i].CaptureRadiusNm, wafers[i].TrueL * 0.98, wafers[i].TrueL * 1.02);
            Assert.False(record.CaptureRadii[i].AtSearchEdge);
        }
        Assert.Equal(["W-A", "W-B", "W-C"], record.WaferIds);
        ArrheniusFit arrhenius = Assert.IsType<ArrheniusFit>(record.Arrhenius);
        Assert.Equal(3, arrhenius.Count);
        Assert.InRange(arrhenius.ActivationEnergy.Value, Ea - 0.1, Ea + 0.1);
        Assert.True(arrhenius.ActivationEnergy.IntervalContains(Ea));
        RadiusModelComparison model = record.RadiusModel!;
        Assert.Equal(RadiusModelKind.PowerLaw, model.Selected);
        Assert.InRange(model.PowerLaw.Parameters[1].Value, 0.45, 0.55);
    }

    [Fact]
    public void Calibrate_TwoWafers_GivesArrheniusWithoutInterval()
    {
        var wafers = new[] { Wafer("W-A", 853.15, 4).Input, Wafer("W-B", 893.15, 5).Input };
        CalibrationRecord record = ProcessCalibrator.Calibrate("cand-2", "p", DateTimeOffset.UnixEpoch, wafers);
        Assert.NotNull(record.Arrhenius);
        Assert.Equal(2, record.Arrhenius!.Count);
        Assert.True(double.IsNaN(record.Arrhenius.ActivationEnergy.StandardError));
        Assert.Contains("no interval", record.Note, StringComparison.Ordinal);
    }

    [Fact]
    public void Calibrate_OneWafer_HasRadiusModelButNoArrhenius()
    {
        CalibrationRecord record = ProcessCalibrator.Calibrate("cand-3", "p", DateTimeOffset.UnixEpoch, [Wafer("W-A", 873.15, 6).Input]);
        Assert.Null(record.Arrhenius);
        Assert.NotNull(record.RadiusModel);
        Assert.Contains("no Arrhenius fit", record.Note, StringComparison.Ordinal);
    }

    [Fact]
    public void Calibrate_DuplicateWafer_Throws()
    {
        WaferCalibrationInput w = Wafer("W-A", 873.15, 7).Input;
        Assert.Throws<ArgumentException>(() => ProcessCalibrator.Calibrate("c", "p", DateTimeOffset.UnixEpoch, [w, w]));
    }
}
