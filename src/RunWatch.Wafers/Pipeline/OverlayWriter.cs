using RunWatch.Imaging.Analysis;

namespace RunWatch.Wafers.Pipeline;

/// <summary>Writes a field's overlay PNG for the report and the dashboard.</summary>
internal static class OverlayWriter
{
    public static async Task WriteAsync(FieldAnalysis analysis, FieldRaster raster, string path, CancellationToken cancellationToken)
    {
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        // Write encodes the rendered pixels as PNG; the renderer's own output is raw RGB, which no viewer can show.
        await Task.Run(() => Imaging.Overlay.OverlayRenderer.Write(analysis, raster, path), cancellationToken).ConfigureAwait(false);
    }
}
