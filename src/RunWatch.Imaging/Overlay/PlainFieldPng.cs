using RunWatch.Imaging.Decoding;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Formats.Png;
using SixLabors.ImageSharp.PixelFormats;

namespace RunWatch.Imaging.Overlay;

/// <summary>
/// A field image as an 8-bit grey PNG at full resolution, with the same contrast stretch as the overlay (1st to 99th
/// percentile), so that a browser can show a TIFF field without the analysis drawn on it.
/// </summary>
public static class PlainFieldPng
{
    /// <summary>Decodes <paramref name="path"/> (any format the analysis reads) and encodes it as PNG.</summary>
    /// <exception cref="ImageDecodeException">The file is not an image the analysis can read.</exception>
    public static byte[] Render(string path, ImageLimits? limits = null)
    {
        GrayImage image = GrayImageDecoder.Decode(path, limits);
        return Encode(image);
    }

    /// <summary>Encodes a decoded image.</summary>
    public static byte[] Encode(GrayImage image)
    {
        ArgumentNullException.ThrowIfNull(image);
        (double lo, double hi) = OverlayRenderer.Stretch(image.Pixels);
        ushort[] px = image.Pixels;
        var grey = new byte[px.Length];
        double scale = 255.0 / (hi - lo);
        for (int i = 0; i < px.Length; i++)
        {
            grey[i] = (byte)Math.Clamp((px[i] - lo) * scale, 0, 255);
        }
        using var png = Image.LoadPixelData<L8>(grey, image.Width, image.Height);
        using var output = new MemoryStream();
        png.SaveAsPng(output, new PngEncoder { CompressionLevel = PngCompressionLevel.BestSpeed });
        return output.ToArray();
    }
}
