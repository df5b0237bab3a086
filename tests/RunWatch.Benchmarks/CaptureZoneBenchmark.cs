using System.Diagnostics;
using System.Globalization;
using System.Text.Json;
using RunWatch.Core.Geometry;
using RunWatch.Core.PointPatterns;
using RunWatch.Testing.Reference;

namespace RunWatch.Benchmarks;

/// <summary>
/// Capture zones for a Poisson pattern in a 4096 × 3072 field (20,000 points; 4,000 with --quick), for L = ∞ and
/// for a finite L that leaves about a third of the zones whole discs, against scipy.spatial.Voronoi + shapely on the
/// same points in the same run (tests/reference/geometry_capture_zones_bench.py, which times its own computation).
/// Goal: at least 10× faster. Prints times, ratios and the total zone area of each side as a cross-check.
/// </summary>
internal sealed class CaptureZoneBenchmark : IBenchmark
{
    private const double Width = 4096, Height = 3072;
    private const int Repeats = 7;

    public string Name => "capture-zones";

    public string Description => "capture zones of 20,000 points (L = ∞ and finite) vs scipy Voronoi + shapely";

    public int Run(bool quick, TextWriter output)
    {
        int count = quick ? 4000 : 20_000;
        var field = CaptureField.Rectangle(Width, Height);
        double density = count / field.Area;
        Point2D[] points = NucleationSites.Poisson(field, density, 2026);
        // A disc is whole when the nearest neighbour is beyond 2L: P = exp(−4πλL²) ≈ 0.32 for L = 0.3/√λ (DERIVED).
        double finiteLength = Math.Round(0.3 / Math.Sqrt(density), 2);
        double[] lengths = [double.PositiveInfinity, finiteLength];

        output.WriteLine($"   {points.Length} Poisson points in {Width} × {Height}; {Environment.ProcessorCount} processors");
        // Warm up every case for at least a second first: tiered compilation only promotes hot methods after a
        // quiet spell of about 100 ms, and a quick run would otherwise time unoptimised code.
        long warmStart = Stopwatch.GetTimestamp();
        for (int w = 0; w < 5 || Stopwatch.GetElapsedTime(warmStart).TotalSeconds < 1.0; w++)
        {
            foreach (double length in lengths)
            {
                CaptureZones.Compute(points, field, new CaptureZoneOptions { DiffusionLength = length });
            }
        }
        var ours = new (double Ms, double Total, int Whole, int Guarded)[lengths.Length];
        for (int k = 0; k < lengths.Length; k++)
        {
            ours[k] = TimeOurs(points, field, lengths[k]);
        }
        JsonElement peer = RunPeer(points, field, lengths);

        JsonElement.ArrayEnumerator results = peer.GetProperty("results").EnumerateArray();
        int index = 0;
        foreach (JsonElement result in results)
        {
            double peerMs = result.GetProperty("seconds").GetDouble() * 1000.0;
            double peerTotal = result.GetProperty("total_area").GetDouble();
            (double ms, double total, int whole, int guarded) = ours[index];
            double ratio = peerMs / ms;
            string label = double.IsPositiveInfinity(lengths[index]) ? "L = ∞" : $"L = {lengths[index]:G4}";
            output.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"   {label,-10} RunWatch {ms,9:F1} ms (median of {Repeats})   scipy+shapely {peerMs,9:F1} ms   ratio {ratio,7:F1}×   goal ≥ 10×: {(ratio >= 10 ? "met" : "NOT met")}"));
            output.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"              whole discs {whole}, guarded {guarded}; total area ours {total:F1}, peer {peerTotal:F1} (relative difference {Math.Abs(total - peerTotal) / peerTotal:E2})"));
            index++;
        }
        return 0;
    }

    private static (double Ms, double Total, int Whole, int Guarded) TimeOurs(Point2D[] points, CaptureField field, double length)
    {
        var options = new CaptureZoneOptions { DiffusionLength = length };
        CaptureZoneResult? result = null;
        var times = new double[Repeats];
        for (int r = 0; r < Repeats; r++)
        {
            long start = Stopwatch.GetTimestamp();
            result = CaptureZones.Compute(points, field, options);
            times[r] = Stopwatch.GetElapsedTime(start).TotalMilliseconds;
        }
        Array.Sort(times);
        double total = 0;
        int whole = 0;
        double disc = double.IsFinite(length) ? Math.PI * length * length : double.NaN;
        foreach (double a in result!.Areas)
        {
            total += a;
            whole += Math.Abs(a - disc) <= 1e-9 * disc ? 1 : 0;
        }
        return (times[Repeats / 2], total, whole, result.Count - result.UnguardedCount);
    }

    private static JsonElement RunPeer(Point2D[] points, CaptureField field, double[] lengths)
    {
        string file = Path.Combine(Path.GetTempPath(), $"runwatch-zones-bench-{Guid.NewGuid():N}.csv");
        try
        {
            using (var writer = new StreamWriter(file))
            {
                foreach (Point2D p in points)
                {
                    writer.WriteLine(string.Create(CultureInfo.InvariantCulture, $"{p.X:R},{p.Y:R}"));
                }
            }
            var args = new List<string> { file, F(field.MinX), F(field.MinY), F(field.MaxX), F(field.MaxY) };
            args.AddRange(lengths.Select(l => double.IsPositiveInfinity(l) ? "inf" : F(l)));
            using JsonDocument json = JsonDocument.Parse(ReferencePython.Run("geometry_capture_zones_bench.py", [.. args]));
            return json.RootElement.Clone();
        }
        finally
        {
            File.Delete(file);
        }
    }

    private static string F(double v) => v.ToString("R", CultureInfo.InvariantCulture);
}
