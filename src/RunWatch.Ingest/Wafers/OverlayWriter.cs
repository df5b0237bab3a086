using RunWatch.Imaging.Analysis;

namespace RunWatch.Ingest.Wafers;

/// <summary>Writes a field's overlay PNG for the report and the dashboard.</summary>
internal static class OverlayWriter
{
    public static async Task WriteAsync(FieldAnalysis analysis, FieldRaster raster, string path, CancellationToken cancellationToken)
    {
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        byte[] png = await Task.Run(() => Imaging.Overlay.OverlayRenderer.Render(analysis, raster), cancellationToken).ConfigureAwait(false);
        await File.WriteAllBytesAsync(path, png, cancellationToken).ConfigureAwait(false);
    }
}
