using System.Buffers.Binary;

namespace RunWatch.Imaging.Decoding;

/// <summary>
/// Detects files cut short: the decoders fill what is missing with zeros rather than fail. PNG: the chunk chain
/// must reach IEND inside the file (ISO/IEC 15948 §5.3) and the image data must inflate to every scanline
/// (<see cref="PngImageData"/>); JPEG: an EOI marker (FFD9) must close the data
/// (ITU-T T.81 B.2.1, trailing bytes tolerated) and each scan must hold every MCU (<see cref="JpegScanCheck"/>); BMP: the pixel array must fit (bfOffBits + stride × height);
/// TIFF: see <see cref="TiffExtentCheck"/>.
/// </summary>
internal static class CompletenessCheck
{
    public static string? FindProblem(Stream stream, string format) => format switch
    {
        "PNG" => Png(stream),
        "JPEG" => Jpeg(stream),
        "BMP" => Bmp(stream),
        "TIFF" => TiffExtentCheck.FindProblem(stream),
        _ => null,
    };

    private static string? Png(Stream stream)
    {
        long length = stream.Length;
        long at = 8;
        Span<byte> header = stackalloc byte[8];
        var idat = new List<(long Offset, long Size)>();
        while (at + 12 <= length)
        {
            stream.Position = at;
            stream.ReadExactly(header);
            long size = BinaryPrimitives.ReadUInt32BigEndian(header);
            long next = at + 12 + size;
            if (header[4..].SequenceEqual("IEND"u8))
            {
                return next <= length ? PngImageData.FindProblem(stream, idat) : "the file ends inside the final PNG chunk (truncated)";
            }
            if (next > length)
            {
                return $"a PNG chunk runs past the end of the file at byte {length:N0} (truncated)";
            }
            if (header[4..].SequenceEqual("IDAT"u8))
            {
                idat.Add((at + 8, size));
            }
            at = next;
        }
        return "the PNG file has no end chunk (truncated)";
    }

    private static string? Jpeg(Stream stream)
    {
        long length = stream.Length;
        int tail = (int)Math.Min(length, 4096);
        var bytes = new byte[tail];
        stream.Position = length - tail;
        stream.ReadExactly(bytes);
        bool ended = false;
        for (int i = tail - 2; i >= 0 && !ended; i--)
        {
            ended = bytes[i] == 0xFF && bytes[i + 1] == 0xD9;
        }
        if (!ended)
        {
            return "the JPEG data has no end-of-image marker (truncated)";
        }
        // An end marker alone proves little: a cut file with FF D9 appended has one. The scans must hold every block.
        var whole = new byte[length];
        stream.Position = 0;
        stream.ReadExactly(whole);
        return JpegScanCheck.FindProblem(whole);
    }

    private static string? Bmp(Stream stream)
    {
        Span<byte> h = stackalloc byte[30];
        stream.Position = 0;
        if (stream.Read(h) < 30)
        {
            return "the file ends inside the BMP header";
        }
        long offset = BinaryPrimitives.ReadUInt32LittleEndian(h[10..]);
        int headerSize = BinaryPrimitives.ReadInt32LittleEndian(h[14..]);
        if (headerSize < 40)
        {
            return null; // OS/2 headers: left to the decoder.
        }
        long width = Math.Abs((long)BinaryPrimitives.ReadInt32LittleEndian(h[18..]));
        long height = Math.Abs((long)BinaryPrimitives.ReadInt32LittleEndian(h[22..]));
        int bits = BinaryPrimitives.ReadUInt16LittleEndian(h[28..]);
        int compression = stream.Length >= 34 ? ReadCompression(stream) : 0;
        if (compression != 0 && compression != 3)
        {
            return null; // run-length data has no fixed size.
        }
        long stride = (width * bits + 31) / 32 * 4;
        long needed = offset + stride * height;
        return needed <= stream.Length ? null : $"the BMP pixel data needs {needed:N0} bytes but the file has {stream.Length:N0} (truncated)";
    }

    private static int ReadCompression(Stream stream)
    {
        Span<byte> c = stackalloc byte[4];
        stream.Position = 30;
        stream.ReadExactly(c);
        return BinaryPrimitives.ReadInt32LittleEndian(c);
    }
}
