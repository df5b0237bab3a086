namespace RunWatch.Web.Data.Fields;

/// <summary>Turns a field image the browser cannot show (TIFF, 16-bit) into a PNG; implemented by the host over the imaging room.</summary>
public interface IFieldImageRenderer
{
    /// <summary>The image as PNG; null when the file cannot be read (the reason is logged by the implementation).</summary>
    Task<byte[]?> RenderPngAsync(string imagePath, CancellationToken cancellationToken);
}
