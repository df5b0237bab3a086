using RunWatch.Core.Profiles;
using RunWatch.Imaging.Measurement;

namespace RunWatch.Imaging.Analysis;

public static partial class FieldAnalyzer
{
    /// <summary>The sub-pixel edge step for every object, row bands in parallel (one <see cref="EdgeRefiner"/> per thread).</summary>
    private static EdgeProfile[] RefineEdges(List<RawWire> raw, ushort[] image, int[] labels, int width, int validHeight, double cosTilt, out double[] alignedProfiles,
        CancellationToken cancellationToken)
    {
        var result = new EdgeProfile[raw.Count];
        double[] profiles = alignedProfiles = new double[raw.Count * EdgeRefiner.Bins];
        // Contiguous chunks, one refiner (and its buffers) per chunk.
        int chunks = Math.Max(1, Math.Min(raw.Count, Environment.ProcessorCount * 4));
        Parallel.For(0, chunks, new ParallelOptions { CancellationToken = cancellationToken }, chunk =>
        {
            var refiner = new EdgeRefiner();
            int from = (int)((long)raw.Count * chunk / chunks), to = (int)((long)raw.Count * (chunk + 1) / chunks);
            for (int i = from; i < to; i++)
            {
                if ((i & 31) == 0)
                {
                    cancellationToken.ThrowIfCancellationRequested(); // every 32 wires (48 rays each)
                }
                result[i] = refiner.Measure(image, labels, width, 0, validHeight, raw[i], cosTilt, profiles.AsSpan(i * EdgeRefiner.Bins, EdgeRefiner.Bins));
            }
        });
        return result;
    }

    /// <summary>
    /// The field's edge model: the mean of the wire candidates' aligned profiles fitted with a blurred step plus an
    /// edge-effect rim (Core <see cref="BlurredEdgeFit"/>). Its offset is where the true edge lies relative to the
    /// half-level crossings (a rim pushes the crossings outwards); its σ corrects areas for the blur.
    /// </summary>
    private static BlurredEdge? FitFieldEdge(double[] profiles, List<int> candidates)
    {
        if (candidates.Count < 5)
        {
            return null;
        }
        var u = new double[EdgeRefiner.Bins];
        var y = new double[EdgeRefiner.Bins];
        var n = new int[EdgeRefiner.Bins];
        foreach (int i in candidates)
        {
            for (int b = 0; b < EdgeRefiner.Bins; b++)
            {
                double v = profiles[(i * EdgeRefiner.Bins) + b];
                if (double.IsFinite(v))
                {
                    y[b] += v;
                    n[b]++;
                }
            }
        }
        for (int b = 0; b < EdgeRefiner.Bins; b++)
        {
            u[b] = (b - EdgeRefiner.BinZero) * EdgeRefiner.BinStep;
            y[b] = n[b] >= candidates.Count / 2 ? y[b] / n[b] : double.NaN;
        }
        try
        {
            BlurredEdge fit = BlurredEdgeFit.Fit(u, y);
            if (Environment.GetEnvironmentVariable("RW_DEBUG_EDGE") is not null)
            {
                Console.WriteLine("PROFILE " + string.Join(" ", y.Select(v => v.ToString("0.000"))) + $" | {fit}");
            }
            return fit.Sigma is > 0.1 and < 4 && Math.Abs(fit.Offset) < 1.5 ? fit : null;
        }
        catch (ArgumentException)
        {
            return null;
        }
    }
}
