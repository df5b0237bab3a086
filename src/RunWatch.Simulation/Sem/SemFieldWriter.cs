using RunWatch.Imaging.Scale;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Formats.Png;
using SixLabors.ImageSharp.PixelFormats;

namespace RunWatch.Simulation.Sem;

/// <summary>Writes a generated field as a 16-bit grayscale PNG with a field sidecar carrying the pixel size.</summary>
public static class SemFieldWriter
{
    /// <summary>Writes <paramref name="path"/> (PNG) and, unless <paramref name="sidecar"/> is false, its <c>.field.json</c>.</summary>
    public static void Write(SemField field, string path, bool sidecar = true, string? waferId = null, FieldPosition? position = null)
    {
        ArgumentNullException.ThrowIfNull(field);
        using (var image = Image.LoadPixelData<L16>(System.Runtime.InteropServices.MemoryMarshal.Cast<ushort, L16>(field.Pixels.AsSpan()), field.Width, field.Height))
        {
            image.SaveAsPng(path, new PngEncoder
            {
                BitDepth = PngBitDepth.Bit16,
                ColorType = PngColorType.Grayscale,
                CompressionLevel = PngCompressionLevel.BestSpeed,
            });
        }
        if (sidecar)
        {
            new FieldSidecar
            {
                PixelSizeNm = field.PixelSizeNm,
                WaferId = waferId,
                FieldPosition = position,
                TiltDeg = 0,
            }.WriteFor(path);
        }
    }
}
