using System.Diagnostics;
using System.Globalization;
using System.Text;
using RunWatch.Commands;
using RunWatch.Core.Geometry;
using RunWatch.Core.Model;
using RunWatch.Core.Model.Diffusion;
using RunWatch.Core.PointPatterns;
using RunWatch.Core.Thermal;
using RunWatch.Growth;
using RunWatch.Simulation.Sem;

namespace RunWatch.Benchmarks;

/// <summary>
/// <c>runwatch model predict</c> on one 2048 × 1536 field at 10 nm pixels (about 420 wires; --quick: 1024 × 768) with
/// a 30-minute 1 Hz log holding an excursion: the whole command (case file, log, image analysis, diffusion table,
/// prediction, JSON), in process. No peer: the figure is reported as asked.
/// </summary>
internal sealed class ModelPredictBenchmark : IBenchmark
{
    public string Name => "model-predict";

    public string Description => "runwatch model predict, whole command, one 2048 × 1536 field";

    public int Run(bool quick, TextWriter output)
    {
        int width = quick ? 1024 : 2048, height = quick ? 768 : 1536;
        const double pixelNm = 10;
        string folder = Directory.CreateTempSubdirectory("runwatch-predict-bench-").FullName;
        try
        {
            var field = CaptureField.Rectangle(width * pixelNm / 1000, (height - 48) * pixelNm / 1000);
            Point2D[] sites = NucleationSites.RandomSequentialAdsorption(field, 1.33, 0.15, 7).Points;
            var random = new Random(7);
            var spec = new SemFieldSpec
            {
                Width = width,
                Height = height,
                PixelSizeNm = pixelNm,
                Seed = 7,
                Sites = sites.Select(p => (p.X * 1000 / pixelNm, p.Y * 1000 / pixelNm)).ToArray(),
                SideOfSite = _ => (35 + (20 * random.NextDouble())) / pixelNm / 0.909,
                InfoStripRows = 48,
            };
            SemFieldWriter.Write(SemFieldGenerator.Generate(spec), Path.Combine(folder, "w.png"), sidecar: false);
            var start = new DateTimeOffset(2026, 3, 2, 8, 0, 0, TimeSpan.Zero);
            var csv = new StringBuilder("time,substrate_tc\n");
            for (int s = 0; s <= 1800; s++)
            {
                double c = 600 + (s is >= 600 and <= 780 ? 25 : 0) + (0.3 * Math.Sin(s * 0.7));
                csv.Append(string.Create(CultureInfo.InvariantCulture, $"{start.AddSeconds(s):yyyy-MM-ddTHH:mm:ss.fffZ},{c:F3}\n"));
            }
            File.WriteAllText(Path.Combine(folder, "w.csv"), csv.ToString());
            File.WriteAllText(Path.Combine(folder, "cases.json"), "{\"format\":\"growth-cases/1\",\"wafers\":[{\"wafer\":\"W1\",\"thermalLog\":\"w.csv\",\"channel\":\"substrate_tc\",\"growthFrom\":\"2026-03-02T08:00:00Z\",\"growthTo\":\"2026-03-02T08:30:00Z\",\"image\":\"w.png\",\"pixelSizeNm\":10}]}");
            // An invented model (λ(610 °C) = 0.6 µm, E_λ = −1.2 eV, κ = 2.5 nm²/(µm²·s), r₀ = 20 nm).
            CaptureLengthLaw law = CaptureLengthLaw.Through(0.6, PhysicalConstants.CelsiusToKelvin(610), -1.2);
            var model = new DiffusionRadiusModel(law.Lambda0SquaredUm2, law.ActivationEv, 2.5, 400, PhysicalConstants.CelsiusToKelvin(610), [], 590, 630, 1200, 2400, 1.5);
            File.WriteAllText(Path.Combine(folder, "model.json"), ModelJson.Serialize(new GrowthModelFile(GrowthModelFile.CurrentFormat, "invented", 20, model, [])));

            long t0 = Stopwatch.GetTimestamp();
            double cpu0 = ThreadCpuClock.NowNs();
            var stdout = new StringWriter();
            var stderr = new StringWriter();
            int code = ModelCommand.Predict(Path.Combine(folder, "model.json"), Path.Combine(folder, "cases.json"), json: true, stdout, stderr);
            double wall = Stopwatch.GetElapsedTime(t0).TotalSeconds;
            double cpu = (ThreadCpuClock.NowNs() - cpu0) / 1e9;
            if (code != 0)
            {
                output.WriteLine("   model predict failed: " + stderr);
                return 1;
            }
            output.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"   {width} × {height} field, {sites.Length} sites, 1801-sample log with a 25 K excursion: model predict {wall:F2} s wall ({cpu:F2} s on the calling thread; the λ solves run on {Environment.ProcessorCount} processors), {stdout.ToString().Length / 1024} KiB of JSON"));
            return 0;
        }
        finally
        {
            Directory.Delete(folder, recursive: true);
        }
    }
}
