using MathNet.Numerics.Distributions;
using RunWatch.Core.Model;
using RunWatch.Core.Model.Prediction;
using RunWatch.Core.Qc;
using RunWatch.Core.Wafers;
using RunWatch.Reports.Model;
using SkiaSharp;

namespace RunWatch.Reports.Tests.Support;

/// <summary>A complete wafer report built from invented demo data (no real run, wafer or person).</summary>
internal static class SampleReport
{
    public const string DataLabel = "invented demo data";

    public static WaferReport Build(string waferId = "W-DEMO-0412-A", string? note = null, int wiresPerField = 90, QcSpecification? spec = null)
    {
        var random = new Random(412);
        var gamma = new Gamma(3.5, 3.5, random);
        var noise = new Normal(0, 3.0, random);
        var wires = new List<WireRow>();
        var fields = new List<FieldThumbnail>();
        const double FieldNm = 6000;
        for (int f = 0; f < 3; f++)
        {
            string name = $"demo-field-{f + 1}.tif";
            var fieldWires = new List<(double X, double Y, double R)>();
            for (int i = 0; i < wiresPerField; i++)
            {
                double x = random.NextDouble() * FieldNm;
                double y = random.NextDouble() * FieldNm;
                bool guard = x < 500 || y < 500 || x > FieldNm - 500 || y > FieldNm - 500;
                double area = guard ? double.NaN : Math.Clamp(0.55 * gamma.Sample(), 0.03, 1);
                double r = (double.IsNaN(area) ? 60 * Math.Sqrt(0.55) : 60 * Math.Sqrt(area)) + noise.Sample();
                wires.Add(new WireRow(name, i + 1, x, y, r, area, double.NaN, random.NextDouble() > 0.12));
                fieldWires.Add((x, y, r));
            }
            fields.Add(new FieldThumbnail(name, Thumbnail(fieldWires, FieldNm), "overlay: outlines and capture-zone guard band", wiresPerField));
        }

        double[] areas = wires.Where(w => double.IsFinite(w.NormalisedArea)).Select(w => w.NormalisedArea).ToArray();
        double[] radii = wires.Where(w => double.IsFinite(w.NormalisedArea)).Select(w => w.RadiusNm).ToArray();
        RadiusModelFit model = RadiusModelFitter.FitAndSelect(areas, radii).SelectedFit;
        wires = wires.Select(w => w with { PredictedRadiusNm = double.IsFinite(w.NormalisedArea) ? model.Predict(w.NormalisedArea) : double.NaN }).ToList();
        PredictedVsMeasured comparison = PredictionComparison.Compare(model, wires.Select(w => w.NormalisedArea).ToArray(), wires.Select(w => w.RadiusNm).ToArray());

        void StandIn(int seed, List<double> list)
        {
            var r = new Random(seed);
            var g = new Gamma(3.5, 3.5, r);
            for (int i = 0; i < 80; i++)
            {
                list.Add(Math.Clamp(0.55 * g.Sample(), 0.03, 1));
            }
        }
        RadiusPrediction prediction = RadiusPredictor.Predict(new RadiusPredictionRequest(model, 420, 2.5e8, 16, 7), StandIn);

        var statistics = WireStatistics.From(wires, 3 * FieldNm * FieldNm * 1e-14);
        ThermalSummary thermal = Thermal();
        var identity = new ReportIdentity(waferId, "R-DEMO-0412", "nw-gaas-std", "demo-chamber-1",
            new DateTimeOffset(2026, 3, 4, 9, 0, 0, TimeSpan.Zero), new DateTimeOffset(2026, 3, 4, 10, 10, 0, TimeSpan.Zero),
            new DateTimeOffset(2026, 3, 6, 14, 30, 0, TimeSpan.Zero), "0.1.0-test", DataLabel,
            note is null ? ["substrate loaded by the demo operator"] : [note]);
        WaferQcInput input = QcInputs.From(identity, statistics, thermal, comparison);
        QcVerdict verdict = QcEvaluator.Evaluate(input, spec ?? Spec());

        return new WaferReport(identity, thermal, fields, wires, statistics, model, 420, prediction, comparison, verdict);
    }

    /// <summary>A report with almost nothing in it: no wires, fields, model, prediction or thermal samples.</summary>
    public static WaferReport Empty(string waferId = "W-DEMO-EMPTY")
    {
        var identity = new ReportIdentity(waferId, "R-DEMO-0000", "nw-gaas-std", "demo-chamber-1", DateTimeOffset.UnixEpoch, null, DateTimeOffset.UnixEpoch, "0.1.0-test", DataLabel, []);
        var thermal = new ThermalSummary([], [], null, 0, 0, [], double.NaN, double.NaN, double.NaN, 1, 0, "no record");
        var statistics = new WireStatistics(0, double.NaN, double.NaN, double.NaN, double.NaN, double.NaN, double.NaN, 0, double.NaN);
        var input = new WaferQcInput(waferId, "nw-gaas-std", 0, null, null, null, null, null, 0, 0, 0);
        QcVerdict verdict = QcEvaluator.Evaluate(input, Spec());
        return new WaferReport(identity, thermal, [], [], statistics, null, 400, null, null, verdict);
    }

    public static QcSpecification Spec() => new()
    {
        TargetMeanRadiusNm = 45,
        MeanRadiusToleranceNm = 10,
        MeanRadiusWarnToleranceNm = 5,
        MaxRadiusCv = 0.35,
        WarnRadiusCv = 0.3,
        MinDensityPerCm2 = 5e7,
        MaxDensityPerCm2 = 5e8,
        MinVerticalYield = 0.7,
        WarnVerticalYield = 0.8,
        MaxAbsBiasNm = 5,
        WarnAbsBiasNm = 2,
        MaxExcursionCount = 2,
        WarnExcursionCount = 0,
        MaxAbsRelativeLChange = 0.1,
        WarnAbsRelativeLChange = 0.02,
        MinThermalCoverage = 0.95,
        MinWireCount = 50,
    };

    private static ThermalSummary Thermal()
    {
        var times = new List<double>();
        var temps = new List<double>();
        for (int s = 0; s <= 4200; s += 10)
        {
            double t = s < 900 ? 25 + (585.0 * s / 900) : s < 3900 ? 610 : 610 - (585.0 * (s - 3900) / 900);
            if (s >= 2100 && s <= 2220)
            {
                t += 14 * Math.Sin(Math.PI * (s - 2100) / 120);
            }
            t += 0.4 * Math.Sin(s / 37.0);
            times.Add(s);
            temps.Add(t);
        }
        return new ThermalSummary(times, temps, 610, 1200, 3600,
            [new ExcursionRow(2100, 2220, 624, 14, 0.031, "over-temperature")],
            408, 421.5, 611.2, 4, 0.998, "gaps over 5 s interpolated linearly and counted against coverage");
    }

    private static byte[] Thumbnail(List<(double X, double Y, double R)> wires, double fieldNm)
    {
        const int Size = 256;
        var info = new SKImageInfo(Size, Size, SKColorType.Rgba8888, SKAlphaType.Premul);
        using var surface = SKSurface.Create(info);
        SKCanvas c = surface.Canvas;
        c.Clear(new SKColor(40, 40, 40));
        using var wire = new SKPaint { Color = new SKColor(220, 220, 220), IsAntialias = true };
        using var outline = new SKPaint { Color = SKColors.Lime, IsStroke = true, StrokeWidth = 1, IsAntialias = true };
        using var guard = new SKPaint { Color = SKColors.Orange, IsStroke = true, StrokeWidth = 1 };
        float scale = (float)(Size / fieldNm);
        foreach ((double x, double y, double r) in wires)
        {
            float radius = Math.Max(1.5f, (float)(r * scale * 6));
            c.DrawCircle((float)x * scale, (float)y * scale, radius, wire);
            c.DrawCircle((float)x * scale, (float)y * scale, radius + 1, outline);
        }
        c.DrawRect(500 * scale, 500 * scale, (float)(fieldNm - 1000) * scale, (float)(fieldNm - 1000) * scale, guard);
        using SKImage image = surface.Snapshot();
        using SKData data = image.Encode(SKEncodedImageFormat.Png, 100);
        return data.ToArray();
    }
}
