using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Formats.Png;
using SixLabors.ImageSharp.PixelFormats;

namespace RunWatch.Imaging.Tests.Support;

/// <summary>Writes small test images with ImageSharp.</summary>
internal static class TestImages
{
    public static void WritePng16(string path, ushort[] pixels, int width, int height)
    {
        using var image = Image.LoadPixelData<L16>(System.Runtime.InteropServices.MemoryMarshal.Cast<ushort, L16>(pixels.AsSpan()), width, height);
        image.SaveAsPng(path, new PngEncoder { BitDepth = PngBitDepth.Bit16, ColorType = PngColorType.Grayscale });
    }

    public static void WriteUniform(string path, int width, int height, ushort value)
    {
        var pixels = new ushort[width * height];
        Array.Fill(pixels, value);
        WritePng16(path, pixels, width, height);
    }

    /// <summary>A PNG that is only a signature and an IHDR chunk claiming <paramref name="width"/> × <paramref name="height"/>.</summary>
    public static byte[] PngHeaderOnly(uint width, uint height)
    {
        var ihdr = new byte[17];
        "IHDR"u8.CopyTo(ihdr);
        System.Buffers.Binary.BinaryPrimitives.WriteUInt32BigEndian(ihdr.AsSpan(4), width);
        System.Buffers.Binary.BinaryPrimitives.WriteUInt32BigEndian(ihdr.AsSpan(8), height);
        ihdr[12] = 8; // bit depth
        ihdr[13] = 0; // grayscale
        var file = new List<byte>([0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A, 0, 0, 0, 13]);
        file.AddRange(ihdr);
        var crc = new byte[4];
        System.Buffers.Binary.BinaryPrimitives.WriteUInt32BigEndian(crc, Crc32(ihdr));
        file.AddRange(crc);
        return file.ToArray();
    }

    /// <summary>A BMP header (BITMAPINFOHEADER, 8 bit) claiming the given size, without pixel data.</summary>
    public static byte[] BmpHeaderOnly(int width, int height)
    {
        var b = new byte[54 + 1024];
        b[0] = (byte)'B';
        b[1] = (byte)'M';
        BitConverter.TryWriteBytes(b.AsSpan(2), b.Length);
        BitConverter.TryWriteBytes(b.AsSpan(10), 54 + 1024);
        BitConverter.TryWriteBytes(b.AsSpan(14), 40);
        BitConverter.TryWriteBytes(b.AsSpan(18), width);
        BitConverter.TryWriteBytes(b.AsSpan(22), height);
        BitConverter.TryWriteBytes(b.AsSpan(26), (short)1);
        BitConverter.TryWriteBytes(b.AsSpan(28), (short)8);
        return b;
    }

    // CRC-32 of PNG (ISO/IEC 15948 Annex D), polynomial 0xEDB88320.
    internal static uint Crc32(ReadOnlySpan<byte> data)
    {
        uint c = 0xFFFFFFFF;
        foreach (byte d in data)
        {
            c ^= d;
            for (int k = 0; k < 8; k++)
            {
                c = (c & 1) != 0 ? 0xEDB88320 ^ (c >> 1) : c >> 1;
            }
        }
        return c ^ 0xFFFFFFFF;
    }
}
