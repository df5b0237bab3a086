using System.Runtime.InteropServices;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Advanced;
using SixLabors.ImageSharp.Formats;
using SixLabors.ImageSharp.Formats.Bmp;
using SixLabors.ImageSharp.Formats.Jpeg;
using SixLabors.ImageSharp.Formats.Png;
using SixLabors.ImageSharp.Formats.Tiff;
using SixLabors.ImageSharp.Metadata.Profiles.Exif;
using SixLabors.ImageSharp.PixelFormats;

namespace RunWatch.Imaging.Decoding;

/// <summary>
/// Decodes TIFF, PNG, JPEG and BMP files into a <see cref="GrayImage"/>. The header is identified first and
/// checked against <see cref="ImageLimits"/>, so no pixel buffer is allocated for a file that is refused.
/// Thread-safe.
/// </summary>
public static class GrayImageDecoder
{
    private static readonly Configuration Formats = new(
        new PngConfigurationModule(), new JpegConfigurationModule(), new BmpConfigurationModule(), new TiffConfigurationModule());

    /// <summary>Decodes <paramref name="path"/>.</summary>
    /// <exception cref="ImageDecodeException">The file is missing, empty, too large, unsupported or damaged.</exception>
    public static GrayImage Decode(string path, ImageLimits? limits = null)
    {
        ArgumentNullException.ThrowIfNull(path);
        limits ??= ImageLimits.Default;
        FileStream stream;
        try
        {
            stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, 1 << 16);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException or ArgumentException or NotSupportedException)
        {
            throw new ImageDecodeException(path, ImageDecodeFailure.NotFound, "cannot open the file: " + ex.Message, ex);
        }
        using (stream)
        {
            return Decode(stream, path, limits);
        }
    }

    /// <summary>Decodes an image from a seekable <paramref name="stream"/>; <paramref name="name"/> is used in messages.</summary>
    /// <exception cref="ImageDecodeException">The content is empty, too large, unsupported or damaged.</exception>
    public static GrayImage Decode(Stream stream, string name, ImageLimits? limits = null)
    {
        ArgumentNullException.ThrowIfNull(stream);
        limits ??= ImageLimits.Default;
        long length = stream.Length;
        if (length == 0)
        {
            throw new ImageDecodeException(name, ImageDecodeFailure.Empty, "the file is empty (0 bytes)");
        }
        if (length > limits.MaxFileBytes)
        {
            throw new ImageDecodeException(name, ImageDecodeFailure.FileTooLarge,
                $"the file has {length:N0} bytes, more than the limit of {limits.MaxFileBytes:N0}");
        }

        IImageInfo? info;
        IImageFormat? format;
        try
        {
            info = Image.Identify(Formats, stream, out format);
        }
        catch (Exception ex) when (ex is not OperationCanceledException)
        {
            throw new ImageDecodeException(name, ImageDecodeFailure.Corrupt, "the image header is damaged: " + ex.Message, ex);
        }
        if (info is null || format is null)
        {
            throw new ImageDecodeException(name, ImageDecodeFailure.UnsupportedFormat,
                "not a TIFF, PNG, JPEG or BMP image (the content decides, not the file extension)");
        }
        long pixels = (long)info.Width * info.Height;
        if (info.Width <= 0 || info.Height <= 0)
        {
            throw new ImageDecodeException(name, ImageDecodeFailure.Corrupt, $"the header gives a size of {info.Width} × {info.Height}");
        }
        if (pixels > limits.MaxPixels)
        {
            throw new ImageDecodeException(name, ImageDecodeFailure.TooManyPixels,
                $"the header claims {info.Width:N0} × {info.Height:N0} = {pixels:N0} pixels, more than the limit of {limits.MaxPixels:N0}");
        }

        {
            string? problem;
            try
            {
                problem = CompletenessCheck.FindProblem(stream, format.Name);
            }
            catch (EndOfStreamException)
            {
                problem = "the file ends early (truncated)";
            }
            catch (Exception ex) when (ex is InvalidDataException or ArgumentException or IOException or OverflowException)
            {
                // Structure the completeness check cannot follow: damaged, whatever the decoder would make of it.
                problem = "the file's structure is damaged: " + ex.Message;
            }
            if (problem is not null)
            {
                throw new ImageDecodeException(name, ImageDecodeFailure.Corrupt, problem);
            }
        }

        stream.Position = 0;
        try
        {
            using Image<L16> image = Image.Load<L16>(Formats, stream, DecoderFor(format));
            if (image.Width != info.Width || image.Height != info.Height)
            {
                throw new ImageDecodeException(name, ImageDecodeFailure.Corrupt, "the decoded size differs from the header");
            }
            var buffer = new ushort[pixels];
            for (int y = 0; y < image.Height; y++)
            {
                ReadOnlySpan<L16> row = image.DangerousGetPixelRowMemory(y).Span;
                MemoryMarshal.Cast<L16, ushort>(row).CopyTo(buffer.AsSpan(y * image.Width, image.Width));
            }
            EmbeddedResolution? resolution = format is TiffFormat ? ReadTiffResolution(image) : null;
            image.Dispose();
            // ImageSharp pools large buffers; hand them back now, the analysis needs the memory next.
            Formats.MemoryAllocator.ReleaseRetainedResources();
            return new GrayImage(info.Width, info.Height, buffer)
            {
                SourceBitsPerPixel = info.PixelType?.BitsPerPixel ?? 0,
                SourceFormat = format.Name,
                Resolution = resolution,
            };
        }
        catch (ImageDecodeException)
        {
            throw;
        }
        catch (Exception ex) when (ex is not OperationCanceledException and not OutOfMemoryException)
        {
            throw new ImageDecodeException(name, ImageDecodeFailure.Corrupt, $"the {format.Name} data is damaged or ends early: {ex.Message}", ex);
        }
    }

    private static IImageDecoder DecoderFor(IImageFormat format) => format switch
    {
        // First frame only: a multi-page TIFF must not allocate every page.
        TiffFormat => new TiffDecoder { DecodingMode = SixLabors.ImageSharp.Metadata.FrameDecodingMode.First },
        PngFormat => new PngDecoder { IgnoreMetadata = true },
        JpegFormat => new JpegDecoder { IgnoreMetadata = true },
        BmpFormat => new BmpDecoder(),
        _ => throw new NotSupportedException(format.Name),
    };

    /// <summary>Reads XResolution, YResolution and ResolutionUnit (TIFF 6.0) from the first frame's tag set.</summary>
    private static EmbeddedResolution? ReadTiffResolution(Image image)
    {
        ExifProfile? tags = image.Frames.RootFrame.Metadata.ExifProfile ?? image.Metadata.ExifProfile;
        if (tags is null)
        {
            return null;
        }
        IExifValue<Rational>? x = tags.GetValue(ExifTag.XResolution);
        IExifValue<Rational>? y = tags.GetValue(ExifTag.YResolution);
        if (x is null)
        {
            return null;
        }
        // TIFF 6.0: ResolutionUnit defaults to 2 (inch) when absent.
        int unit = tags.GetValue(ExifTag.ResolutionUnit)?.Value ?? 2;
        double xr = x.Value.ToDouble();
        double yr = y?.Value.ToDouble() ?? xr;
        return new EmbeddedResolution(xr, yr, unit);
    }
}
