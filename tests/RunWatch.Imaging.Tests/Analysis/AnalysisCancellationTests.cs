using RunWatch.Imaging.Analysis;
using RunWatch.Imaging.Tests.Support;
using Xunit;

namespace RunWatch.Imaging.Tests.Analysis;

/// <summary>
/// The analysis stops itself when its token is cancelled: a pathological field (a 4000 × 3000 image holding some
/// 80 000 small wires, each with its sub-pixel edge fit, nearest neighbour and capture zone; many seconds of work)
/// is cancelled shortly after it starts, and the analysis task itself ends with <see cref="OperationCanceledException"/>
/// instead of running on to a result. No time is asserted: the test only needs the work to outlast the delay.
/// </summary>
public sealed class AnalysisCancellationTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public async Task AnalyzeWithRaster_TokenCancelledWhileRunning_StopsTheWorkWithOperationCanceled()
    {
        string path = _folder.File("crowded.png");
        const int Width = 4000, Height = 3000;
        TestImages.WritePng16(path, Crowded(Width, Height), Width, Height);
        using var stop = new CancellationTokenSource();

        Task<(FieldAnalysis, FieldRaster)> analysis = Task.Run(() => FieldAnalyzer.AnalyzeWithRaster(path,
            new FieldAnalysisOptions { PixelSizeNm = 2, DiffusionLengthNm = 40, DetectInfoStrip = false }, stop.Token));
        stop.CancelAfter(TimeSpan.FromMilliseconds(400));

        await Assert.ThrowsAnyAsync<OperationCanceledException>(() => analysis);
        Assert.True(analysis.IsCanceled || analysis.IsFaulted);
    }

    [Fact]
    public void AnalyzeWithRaster_TokenNeverCancelled_SameResultAsWithout()
    {
        string path = _folder.File("small.png");
        TestImages.WritePng16(path, Crowded(400, 300), 400, 300);
        var options = new FieldAnalysisOptions { PixelSizeNm = 2, DiffusionLengthNm = 40, DetectInfoStrip = false };

        var (withToken, _) = FieldAnalyzer.AnalyzeWithRaster(path, options, new CancellationTokenSource().Token);
        var (without, _) = FieldAnalyzer.AnalyzeWithRaster(path, options);

        Assert.True(withToken.Wires.Count > 500);
        Assert.Equal(without.Wires.Select(w => (w.ThresholdRadius, w.CentroidZoneNormalized)), withToken.Wires.Select(w => (w.ThresholdRadius, w.CentroidZoneNormalized)));
    }

    /// <summary>Bright discs of radius 3.5 px on a 14 px grid (jittered, seeded) over a dark background with mild noise.</summary>
    private static ushort[] Crowded(int width, int height)
    {
        var random = new Random(23);
        var pixels = new ushort[width * height];
        for (int i = 0; i < pixels.Length; i++)
        {
            pixels[i] = (ushort)(8000 + random.Next(0, 1500));
        }
        for (int cy = 10; cy < height - 10; cy += 14)
        {
            for (int cx = 10; cx < width - 10; cx += 14)
            {
                double x0 = cx + random.NextDouble() * 3, y0 = cy + random.NextDouble() * 3;
                for (int y = (int)y0 - 4; y <= (int)y0 + 4; y++)
                {
                    for (int x = (int)x0 - 4; x <= (int)x0 + 4; x++)
                    {
                        if ((x - x0) * (x - x0) + (y - y0) * (y - y0) <= 3.5 * 3.5)
                        {
                            pixels[(y * width) + x] = 50000;
                        }
                    }
                }
            }
        }
        return pixels;
    }
}
