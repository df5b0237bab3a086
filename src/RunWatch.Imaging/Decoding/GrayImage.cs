namespace RunWatch.Imaging.Decoding;

/// <summary>
/// A decoded grayscale image on a 16-bit scale (8-bit sources are scaled by 257, colour sources reduced to
/// luminance), row-major, in a buffer the caller owns.
/// </summary>
public sealed class GrayImage
{
    public GrayImage(int width, int height, ushort[] pixels)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(width);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(height);
        ArgumentNullException.ThrowIfNull(pixels);
        if (pixels.LongLength != (long)width * height)
        {
            throw new ArgumentException($"expected {(long)width * height} pixels, got {pixels.LongLength}", nameof(pixels));
        }
        Width = width;
        Height = height;
        Pixels = pixels;
    }

    public int Width { get; }

    public int Height { get; }

    /// <summary>Row-major pixels, 0..65535.</summary>
    public ushort[] Pixels { get; }

    /// <summary>Bits per pixel of the source file (8, 16, 24, 48 ...), 16 for images built in memory.</summary>
    public int SourceBitsPerPixel { get; init; } = 16;

    /// <summary>The source format's name (TIFF, PNG, JPEG, BMP), or "memory".</summary>
    public string SourceFormat { get; init; } = "memory";

    /// <summary>Resolution from standard TIFF tags, when the file had them.</summary>
    public EmbeddedResolution? Resolution { get; init; }

    /// <summary>Bytes held by <see cref="Pixels"/>.</summary>
    public long SizeBytes => Pixels.LongLength * sizeof(ushort);
}
