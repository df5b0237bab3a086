using System.Diagnostics;
using System.Globalization;
using System.Text.Json;
using RunWatch.Imaging.Analysis;
using RunWatch.Simulation.Sem;
using RunWatch.Testing.Reference;

namespace RunWatch.Benchmarks;

/// <summary>
/// The whole field analysis (decode → capture zones) on a generated 4096 × 3072 16-bit field of about 20,000
/// wires, against an OpenCV pipeline (python3-opencv: decode, blur, Otsu, connected components with stats,
/// distance transforms) on the same file in the same run; then the peak memory of <c>runwatch analyze</c> in a
/// child process against the decoded image's size. Goals: time ratio ≤ 1.5, memory ≤ 10× the decoded image.
/// </summary>
internal sealed class ImagingBenchmark : IBenchmark
{
    private const double PixelSizeNm = 5;
    private const double DiffusionLengthUm = 0.1;

    public string Name => "imaging";

    public string Description => "field analysis of a 4096 × 3072 16-bit field (~20,000 wires) vs an OpenCV pipeline; peak memory";

    public int Run(bool quick, TextWriter output)
    {
        int width = quick ? 2048 : 4096, height = quick ? 1536 : 3072, strip = quick ? 36 : 72;
        int sites = quick ? 4750 : 19000;
        int repeats = quick ? 2 : 3;
        string folder = Path.Combine(Path.GetTempPath(), "runwatch-imaging-bench-" + Environment.ProcessId.ToString(CultureInfo.InvariantCulture));
        Directory.CreateDirectory(folder);
        try
        {
            string path = Path.Combine(folder, "field.png");
            var clock = Stopwatch.StartNew();
            SemField field = Generate(width, height, strip, sites);
            SemFieldWriter.Write(field, path);
            long decodedBytes = (long)width * height * sizeof(ushort);
            output.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"   field: {width} × {height}, {field.Objects.Count:N0} objects drawn, {new FileInfo(path).Length / 1048576.0:0.0} MiB PNG, generated in {clock.Elapsed.TotalSeconds:0.0} s"));
            field = null!;
            GC.Collect();

            var options = new FieldAnalysisOptions { DiffusionLengthNm = DiffusionLengthUm * 1000 };
            FieldAnalysis analysis = FieldAnalyzer.Analyze(path, options);
            var times = new List<double>();
            for (int r = 0; r < repeats; r++)
            {
                clock.Restart();
                analysis = FieldAnalyzer.Analyze(path, options);
                times.Add(clock.Elapsed.TotalMilliseconds);
            }
            double ours = Median(times);
            output.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"   RunWatch: {analysis.Statistics.ObjectsFound:N0} objects ({analysis.Statistics.Vertical:N0} vertical interior), threshold {analysis.Threshold}; median of {repeats}: {ours:0} ms"));
            output.WriteLine("     stages (last run): " + string.Join(", ", analysis.Timings.Select(t => string.Create(CultureInfo.InvariantCulture, $"{t.Stage} {t.Milliseconds:0}"))));

            // The same pipeline without the sub-pixel edge step (threshold radii; segmentation, hole filling and notch cuts
            // unchanged): the cost of measuring at the edge, the issue's goal. Then also without hole filling and notch cuts,
            // the pipeline as it was before those radius steps existed.
            var plainOptions = new FieldAnalysisOptions { DiffusionLengthNm = DiffusionLengthUm * 1000, SubPixelEdges = false };
            var bareOptions = new FieldAnalysisOptions { DiffusionLengthNm = DiffusionLengthUm * 1000, SubPixelEdges = false, MaxHolePixels = 0, NotchDepthPixels = 0 };
            FieldAnalysis plainAnalysis = FieldAnalyzer.Analyze(path, plainOptions);
            FieldAnalyzer.Analyze(path, bareOptions);
            // Interleaved, so that a change of machine load falls on all three alike.
            var plainTimes = new List<double>();
            var bareTimes = new List<double>();
            var withTimes = new List<double>(times);
            for (int r = 0; r < repeats; r++)
            {
                clock.Restart();
                plainAnalysis = FieldAnalyzer.Analyze(path, plainOptions);
                plainTimes.Add(clock.Elapsed.TotalMilliseconds);
                clock.Restart();
                FieldAnalyzer.Analyze(path, bareOptions);
                bareTimes.Add(clock.Elapsed.TotalMilliseconds);
                clock.Restart();
                FieldAnalyzer.Analyze(path, options);
                withTimes.Add(clock.Elapsed.TotalMilliseconds);
            }
            double with = Median(withTimes), plain = Median(plainTimes), bare = Median(bareTimes);
            output.WriteLine("     stages without the edge step (last run): " + string.Join(", ", plainAnalysis.Timings.Select(t => string.Create(CultureInfo.InvariantCulture, $"{t.Stage} {t.Milliseconds:0}"))));
            output.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"   sub-pixel edge step: {with:0} ms with, {plain:0} ms without (threshold radii); extra {100 * ((with / plain) - 1):0} % (goal ≤ 25 %)"));
            output.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"   all radius steps (edge step, hole filling, notch cuts): {bare:0} ms without them; extra {100 * ((with / bare) - 1):0} %"));

            using JsonDocument peer = JsonDocument.Parse(ReferencePython.Run("imaging_opencv_bench.py", path,
                repeats.ToString(CultureInfo.InvariantCulture), analysis.ExcludedBottomRows.ToString(CultureInfo.InvariantCulture)));
            JsonElement ms = peer.RootElement.GetProperty("ms");
            double theirs = ms.GetProperty("total").GetDouble();
            output.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"   OpenCV {Cv2Version()}: {peer.RootElement.GetProperty("components").GetInt32():N0} components, threshold {peer.RootElement.GetProperty("threshold").GetDouble():0}; median of {repeats}: {theirs:0} ms"));
            output.WriteLine("     steps: " + string.Join(", ", ms.EnumerateObject().Where(p => p.Name != "total").Select(p => string.Create(CultureInfo.InvariantCulture, $"{p.Name} {p.Value.GetDouble():0}"))));
            output.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"   ratio RunWatch / OpenCV = {with / theirs:0.00} (goal ≤ 1.5; RunWatch also flattens, splits touching wires, measures hulls and computes both kinds of zones)"));

            (long peak, long baseline) = PeakMemory(path, folder);
            output.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"   memory: decoded image {decodedBytes / 1048576.0:0.0} MiB; `runwatch analyze` peak RSS {peak / 1048576.0:0} MiB = {(double)peak / decodedBytes:0.0}× (runtime baseline {baseline / 1048576.0:0} MiB; above it {(double)(peak - baseline) / decodedBytes:0.0}×; goal ≤ 10×); OpenCV peak RSS {peer.RootElement.GetProperty("peak_rss_mib").GetDouble():0} MiB"));
            return 0;
        }
        finally
        {
            Directory.Delete(folder, recursive: true);
        }
    }

    private static SemField Generate(int width, int height, int strip, int sites)
    {
        IReadOnlyList<(double X, double Y)> points = SemSites.Scatter(width, height - strip, sites, 17, 0.05, 9.5, seed: 2026, margin: 1);
        var random = new Random(2026);
        var sides = new double[points.Count];
        for (int i = 0; i < sides.Length; i++)
        {
            sides[i] = 5 + 1.5 * random.NextDouble();
        }
        return SemFieldGenerator.Generate(new SemFieldSpec
        {
            Width = width,
            Height = height,
            Seed = 2026,
            Sites = points,
            SideOfSite = i => sides[i],
            InfoStripRows = strip,
            PixelSizeNm = PixelSizeNm,
            ParasiticPerThousandSites = 5,
        });
    }

    /// <summary>Peak resident memory (VmHWM) of `runwatch analyze` on the field and on a 1 × 1 image (the runtime's own share).</summary>
    private static (long Peak, long Baseline) PeakMemory(string path, string folder)
    {
        string tiny = Path.Combine(folder, "tiny.png");
        SemFieldWriter.Write(SemFieldGenerator.Generate(new SemFieldSpec { Width = 1, Height = 1, InfoStripRows = 0 }), tiny);
        return (ChildPeak(path), ChildPeak(tiny));
    }

    private static long ChildPeak(string image)
    {
        string dll = Path.Combine(AppContext.BaseDirectory, "runwatch.dll");
        var psi = new ProcessStartInfo("dotnet") { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        foreach (string a in (string[])[dll, "analyze", image, "--diffusion-length-um", DiffusionLengthUm.ToString(CultureInfo.InvariantCulture)])
        {
            psi.ArgumentList.Add(a);
        }
        using Process process = Process.Start(psi) ?? throw new InvalidOperationException("cannot start runwatch analyze");
        Task<string> drainOut = process.StandardOutput.ReadToEndAsync();
        Task<string> drainErr = process.StandardError.ReadToEndAsync();
        long peak = 0;
        string status = $"/proc/{process.Id}/status";
        while (!process.HasExited)
        {
            try
            {
                foreach (string line in File.ReadLines(status))
                {
                    if (line.StartsWith("VmHWM:", StringComparison.Ordinal))
                    {
                        peak = Math.Max(peak, 1024 * long.Parse(line.Split(' ', StringSplitOptions.RemoveEmptyEntries)[1], CultureInfo.InvariantCulture));
                    }
                }
            }
            catch (IOException)
            {
                break;
            }
            process.WaitForExit(15);
        }
        process.WaitForExit();
        drainOut.GetAwaiter().GetResult();
        string err = drainErr.GetAwaiter().GetResult();
        if (process.ExitCode != 0)
        {
            throw new InvalidOperationException($"runwatch analyze exited {process.ExitCode}: {err}");
        }
        return peak;
    }

    private static string Cv2Version()
    {
        try
        {
            return ReferencePython.Run("imaging_cv2_version.py").Trim();
        }
        catch (InvalidOperationException)
        {
            return "(version unknown)";
        }
    }

    private static double Median(List<double> values)
    {
        var sorted = values.OrderBy(v => v).ToArray();
        return sorted.Length % 2 == 1 ? sorted[sorted.Length / 2] : (sorted[sorted.Length / 2 - 1] + sorted[sorted.Length / 2]) / 2;
    }
}
