using RunWatch.Imaging.Decoding;
using RunWatch.Imaging.Overlay;
using RunWatch.Web.Data.Fields;

namespace RunWatch.Hosting;

/// <summary>Renders a field image (TIFF, 16-bit) as PNG for the full-field viewer, through the imaging room's decoder.</summary>
internal sealed partial class PipelineFieldImageRenderer(ILogger<PipelineFieldImageRenderer> logger) : IFieldImageRenderer
{
    public async Task<byte[]?> RenderPngAsync(string imagePath, CancellationToken cancellationToken)
    {
        try
        {
            return await Task.Run(() => PlainFieldPng.Render(imagePath), cancellationToken).ConfigureAwait(false);
        }
        catch (Exception ex) when (ex is ImageDecodeException or IOException or UnauthorizedAccessException)
        {
            LogUnreadable(logger, Path.GetFileName(imagePath), ex.Message);
            return null;
        }
    }

    [LoggerMessage(Level = LogLevel.Warning, Message = "Field image {File} cannot be shown in the viewer: {Reason}")]
    private static partial void LogUnreadable(ILogger logger, string file, string reason);
}
