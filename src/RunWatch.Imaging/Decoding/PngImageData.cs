using System.Buffers.Binary;
using System.IO.Compression;

namespace RunWatch.Imaging.Decoding;

/// <summary>
/// A PNG whose chunk chain is whole can still carry image data cut short (an IDAT written with less data and a
/// correct length): the zlib stream must end, and it must inflate to exactly the filtered scanlines the header
/// promises, <c>height × (1 + ⌈width × channels × bitDepth / 8⌉)</c> bytes, summed over the seven Adam7 passes for
/// interlaced images (ISO/IEC 15948 §7.2, §8.2; DERIVED from the format). Inflates once more than the decoder does,
/// streaming, without keeping the pixels.
/// </summary>
internal static class PngImageData
{
    public static string? FindProblem(Stream stream, IReadOnlyList<(long Offset, long Size)> idat)
    {
        if (idat.Count == 0)
        {
            return "the PNG file has no image data";
        }
        Span<byte> ihdr = stackalloc byte[13];
        stream.Position = 16;
        stream.ReadExactly(ihdr);
        long width = BinaryPrimitives.ReadUInt32BigEndian(ihdr);
        long height = BinaryPrimitives.ReadUInt32BigEndian(ihdr[4..]);
        int bitDepth = ihdr[8];
        int channels = ihdr[9] switch { 0 => 1, 2 => 3, 3 => 1, 4 => 2, 6 => 4, _ => 0 };
        if (channels == 0 || bitDepth is not (1 or 2 or 4 or 8 or 16) || width == 0 || height == 0)
        {
            return null; // not a header this check understands: left to the decoder.
        }
        long expected = ihdr[12] == 1 ? Adam7Bytes(width, height, channels, bitDepth) : ScanlineBytes(width, height, channels, bitDepth);
        long produced = 0;
        try
        {
            using var compressed = new ChunkDataStream(stream, idat);
            using var inflate = new ZLibStream(compressed, CompressionMode.Decompress, leaveOpen: true);
            byte[] buffer = new byte[1 << 16];
            int read;
            while ((read = inflate.Read(buffer, 0, buffer.Length)) > 0)
            {
                produced += read;
                if (produced > expected)
                {
                    return null; // more than needed: extra data the decoder ignores, not a cut file.
                }
            }
        }
        catch (InvalidDataException)
        {
            return "the PNG image data is not a valid zlib stream (damaged or truncated)";
        }
        return produced < expected
            ? $"the PNG image data inflates to {produced:N0} of {expected:N0} bytes (truncated)"
            : null;
    }

    private static long ScanlineBytes(long width, long height, int channels, int bitDepth) =>
        width == 0 || height == 0 ? 0 : height * (1 + ((width * channels * bitDepth) + 7) / 8);

    private static long Adam7Bytes(long width, long height, int channels, int bitDepth)
    {
        // Adam7 pass origins and steps (ISO/IEC 15948 §8.2).
        ReadOnlySpan<int> x0 = [0, 4, 0, 2, 0, 1, 0];
        ReadOnlySpan<int> y0 = [0, 0, 4, 0, 2, 0, 1];
        ReadOnlySpan<int> dx = [8, 8, 4, 4, 2, 2, 1];
        ReadOnlySpan<int> dy = [8, 8, 8, 4, 4, 2, 2];
        long total = 0;
        for (int p = 0; p < 7; p++)
        {
            long w = width > x0[p] ? (width - x0[p] + dx[p] - 1) / dx[p] : 0;
            long h = height > y0[p] ? (height - y0[p] + dy[p] - 1) / dy[p] : 0;
            total += ScanlineBytes(w, h, channels, bitDepth);
        }
        return total;
    }
}
