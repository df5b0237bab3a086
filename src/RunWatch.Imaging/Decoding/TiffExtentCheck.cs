using System.Buffers.Binary;

namespace RunWatch.Imaging.Decoding;

/// <summary>
/// Checks that the first image's strips or tiles lie inside the file: the TIFF decoder fills data missing at the
/// end of a truncated file with zeros instead of failing. Reads the first IFD only (TIFF 6.0 section 2):
/// StripOffsets (273), StripByteCounts (279), TileOffsets (324), TileByteCounts (325), of every integer type
/// (SHORT, LONG, SSHORT, SLONG); a strip tag of any other type fails the file.
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
            if (tag is 273 or 324 or 279 or 325)
            {
                ushort type = Read16(e[2..], little);
                if (ValueSize(type) == 0)
                {
                    // Fail closed: a strip tag this check cannot read would let a cut file through.
                    return $"TIFF tag {tag} has field type {type}, which is not a valid type for strip or tile positions";
                }
                var values = ReadValues(stream, e, little, length);
                if (values is null)
                {
                    return $"TIFF tag {tag} holds no usable values";
                }
                if (tag is 273 or 324)
                {
                    offsets = values;
                }
                else
                {
                    sizes = values;
                }
            }
        }
        if (offsets is null || sizes is null || offsets.Length != sizes.Length)
        {
            return offsets is null && sizes is null ? null : "strip offsets and byte counts do not match";
        }
        for (int i = 0; i < offsets.Length; i++)
        {
            if (offsets[i] < 0 || sizes[i] < 0)
            {
                return "a strip offset or byte count is negative";
            }
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
        int size = ValueSize(type);
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
            values[i] = type switch
            {
                3 => Read16(data.AsSpan(2 * i), little),
                8 => (short)Read16(data.AsSpan(2 * i), little),
                9 => (int)Read32(data.AsSpan(4 * i), little),
                _ => Read32(data.AsSpan(4 * i), little),
            };
        }
        return values;
    }

    /// <summary>
    /// Bytes per value of the integer TIFF field types a strip or tile position can have: SHORT (3) and LONG (4) per
    /// TIFF 6.0, and the signed SSHORT (8) and SLONG (9) some writers use; 0 for any other type.
    /// </summary>
    private static int ValueSize(ushort type) => type switch { 3 or 8 => 2, 4 or 9 => 4, _ => 0 };

    private static ushort Read16(ReadOnlySpan<byte> b, bool little) =>
        little ? BinaryPrimitives.ReadUInt16LittleEndian(b) : BinaryPrimitives.ReadUInt16BigEndian(b);

    private static uint Read32(ReadOnlySpan<byte> b, bool little) =>
        little ? BinaryPrimitives.ReadUInt32LittleEndian(b) : BinaryPrimitives.ReadUInt32BigEndian(b);
}
