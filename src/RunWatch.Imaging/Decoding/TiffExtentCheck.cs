using System.Buffers.Binary;

namespace RunWatch.Imaging.Decoding;

/// <summary>
/// Checks that the first image's strips or tiles lie inside the file: the TIFF decoder fills data missing at the
/// end of a truncated file with zeros instead of failing. Reads the first IFD only (TIFF 6.0 section 2):
/// StripOffsets (273), StripByteCounts (279), TileOffsets (324), TileByteCounts (325).
/// </summary>
internal static class TiffExtentCheck
{
    private const int MaxEntries = 4096;

    /// <summary>Returns null when every strip or tile ends inside the file, else the reason.</summary>
    public static string? FindProblem(Stream stream)
    {
        long length = stream.Length;
        Span<byte> head = stackalloc byte[8];
        stream.Position = 0;
        if (stream.Read(head) < 8)
        {
            return "the file ends inside the TIFF header";
        }
        bool little = head[0] == (byte)'I';
        ushort magic = Read16(head[2..], little);
        if (magic != 42)
        {
            return null; // BigTIFF or other: left to the decoder.
        }
        long ifd = Read32(head[4..], little);
        if (ifd + 2 > length)
        {
            return "the first image directory lies beyond the end of the file";
        }
        stream.Position = ifd;
        Span<byte> countBytes = stackalloc byte[2];
        stream.ReadExactly(countBytes);
        int count = Read16(countBytes, little);
        if (count > MaxEntries || ifd + 2 + 12L * count > length)
        {
            return "the first image directory is cut short";
        }
        var entries = new byte[12 * count];
        stream.ReadExactly(entries);
        long[]? offsets = null, sizes = null;
        for (int i = 0; i < count; i++)
        {
            ReadOnlySpan<byte> e = entries.AsSpan(12 * i, 12);
            ushort tag = Read16(e, little);
            if (tag is 273 or 324)
            {
                offsets = ReadValues(stream, e, little, length);
            }
            else if (tag is 279 or 325)
            {
                sizes = ReadValues(stream, e, little, length);
            }
        }
        if (offsets is null || sizes is null || offsets.Length != sizes.Length)
        {
            return offsets is null && sizes is null ? null : "strip offsets and byte counts do not match";
        }
        for (int i = 0; i < offsets.Length; i++)
        {
            if (offsets[i] + sizes[i] > length)
            {
                return $"image data ends at byte {offsets[i] + sizes[i]:N0} but the file has {length:N0} bytes (truncated)";
            }
        }
        return null;
    }

    private static long[]? ReadValues(Stream stream, ReadOnlySpan<byte> entry, bool little, long length)
    {
        ushort type = Read16(entry[2..], little);
        long n = Read32(entry[4..], little);
        int size = type switch { 3 => 2, 4 => 4, _ => 0 };
        if (size == 0 || n <= 0 || n > 10_000_000)
        {
            return null;
        }
        byte[] data;
        if (n * size <= 4)
        {
            data = entry.Slice(8, 4).ToArray();
        }
        else
        {
            long at = Read32(entry[8..], little);
            if (at + n * size > length)
            {
                return [long.MaxValue / 2];
            }
            data = new byte[n * size];
            long keep = stream.Position;
            stream.Position = at;
            stream.ReadExactly(data);
            stream.Position = keep;
        }
        var values = new long[n];
        for (int i = 0; i < n; i++)
        {
            values[i] = size == 2 ? Read16(data.AsSpan(2 * i), little) : Read32(data.AsSpan(4 * i), little);
        }
        return values;
    }

    private static ushort Read16(ReadOnlySpan<byte> b, bool little) =>
        little ? BinaryPrimitives.ReadUInt16LittleEndian(b) : BinaryPrimitives.ReadUInt16BigEndian(b);

    private static uint Read32(ReadOnlySpan<byte> b, bool little) =>
        little ? BinaryPrimitives.ReadUInt32LittleEndian(b) : BinaryPrimitives.ReadUInt32BigEndian(b);
}
