using System.Buffers.Binary;
using RunWatch.Imaging.Decoding;
using RunWatch.Imaging.Tests.Support;
using Xunit;

namespace RunWatch.Imaging.Tests.Decoding;

/// <summary>
/// Cut files dressed up to look whole: a PNG whose image data is cut but whose chunks are complete (lengths and CRCs
/// correct), and a TIFF whose strip tags use the signed SLONG type. Each must fail as truncated, not decode with
/// zero-filled rows.
/// </summary>
public sealed class TruncationBypassTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Theory]
    [InlineData(0.33)]
    [InlineData(0.9)]
    public void Decode_PngWithCutImageDataInCompleteChunks_SaysTruncated(double keep)
    {
        string path = _folder.File("cut-idat.png");
        TestImages.WritePng16(path, Noise(400, 300), 400, 300);
        byte[] whole = File.ReadAllBytes(path);
        byte[] data = ImageData(whole);
        File.WriteAllBytes(path, Rebuild(whole, data[..(int)(data.Length * keep)]));

        var ex = Assert.Throws<ImageDecodeException>(() => GrayImageDecoder.Decode(path));

        Assert.Equal(ImageDecodeFailure.Corrupt, ex.Failure);
        Assert.Contains("truncated", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Decode_PngRebuiltWithAllItsImageData_StillDecodes()
    {
        // Control: the same rebuilding with nothing cut gives a file the check accepts.
        string path = _folder.File("whole.png");
        ushort[] pixels = Noise(400, 300);
        TestImages.WritePng16(path, pixels, 400, 300);
        byte[] whole = File.ReadAllBytes(path);
        File.WriteAllBytes(path, Rebuild(whole, ImageData(whole)));

        GrayImage image = GrayImageDecoder.Decode(path);

        Assert.Equal(pixels[^1], image.Pixels[^1]);
    }

    [Fact]
    public void Decode_TiffWithSlongStripTagsCut_SaysTruncated()
    {
        string path = _folder.File("slong.tif");
        ReferenceTiff.Write(path, "I;16", 0, 0, 0);
        byte[] bytes = File.ReadAllBytes(path);
        Assert.True(RetypeStripTags(bytes), "the reference TIFF has no strip tags to retype");
        File.WriteAllBytes(path, bytes[..(bytes.Length / 2)]);

        var ex = Assert.Throws<ImageDecodeException>(() => GrayImageDecoder.Decode(path));

        Assert.Contains("truncated", ex.Message, StringComparison.Ordinal);
    }

    private static ushort[] Noise(int width, int height)
    {
        var random = new Random(11);
        var pixels = new ushort[width * height];
        for (int i = 0; i < pixels.Length; i++)
        {
            pixels[i] = (ushort)random.Next(0, 65536);
        }
        return pixels;
    }

    /// <summary>The IDAT chunks' data, concatenated (ISO/IEC 15948 §5.3 chunk layout: length, type, data, CRC).</summary>
    private static byte[] ImageData(byte[] png)
    {
        var data = new List<byte>();
        for (int at = 8; at + 12 <= png.Length;)
        {
            int size = (int)BinaryPrimitives.ReadUInt32BigEndian(png.AsSpan(at));
            if (png.AsSpan(at + 4, 4).SequenceEqual("IDAT"u8))
            {
                data.AddRange(png.AsSpan(at + 8, size).ToArray());
            }
            at += 12 + size;
        }
        return [.. data];
    }

    /// <summary>Signature and IHDR of the original, one IDAT holding <paramref name="data"/> with a correct CRC, IEND.</summary>
    private static byte[] Rebuild(byte[] original, byte[] data)
    {
        var file = new List<byte>(original.AsSpan(0, 8 + 12 + 13).ToArray());
        AddChunk(file, "IDAT"u8, data);
        AddChunk(file, "IEND"u8, []);
        return [.. file];
    }

    private static void AddChunk(List<byte> file, ReadOnlySpan<byte> type, byte[] data)
    {
        var length = new byte[4];
        BinaryPrimitives.WriteUInt32BigEndian(length, (uint)data.Length);
        file.AddRange(length);
        byte[] typed = [.. type, .. data];
        file.AddRange(typed);
        var crc = new byte[4];
        BinaryPrimitives.WriteUInt32BigEndian(crc, TestImages.Crc32(typed));
        file.AddRange(crc);
    }

    /// <summary>Changes the field type of StripOffsets (273) and StripByteCounts (279) from LONG/SHORT to SLONG/SSHORT (TIFF 6.0 §2).</summary>
    private static bool RetypeStripTags(byte[] tiff)
    {
        bool little = tiff[0] == (byte)'I';
        uint ifd = little ? BinaryPrimitives.ReadUInt32LittleEndian(tiff.AsSpan(4)) : BinaryPrimitives.ReadUInt32BigEndian(tiff.AsSpan(4));
        int count = little ? BinaryPrimitives.ReadUInt16LittleEndian(tiff.AsSpan((int)ifd)) : BinaryPrimitives.ReadUInt16BigEndian(tiff.AsSpan((int)ifd));
        int changed = 0;
        for (int i = 0; i < count; i++)
        {
            var e = tiff.AsSpan((int)ifd + 2 + (12 * i), 12);
            ushort tag = little ? BinaryPrimitives.ReadUInt16LittleEndian(e) : BinaryPrimitives.ReadUInt16BigEndian(e);
            ushort type = little ? BinaryPrimitives.ReadUInt16LittleEndian(e[2..]) : BinaryPrimitives.ReadUInt16BigEndian(e[2..]);
            if (tag is 273 or 279)
            {
                ushort signed = type == 4 ? (ushort)9 : (ushort)8;
                if (little)
                {
                    BinaryPrimitives.WriteUInt16LittleEndian(e[2..], signed);
                }
                else
                {
                    BinaryPrimitives.WriteUInt16BigEndian(e[2..], signed);
                }
                changed++;
            }
        }
        return changed == 2;
    }
}
