using System.Buffers.Binary;

namespace RunWatch.Imaging.Decoding;

/// <summary>
/// Walks the entropy-coded scans of a Huffman-coded sequential JPEG (SOF0, SOF1) and counts the blocks each scan
/// really holds, without reconstructing pixels. A file cut inside its scan and closed with an appended EOI marker
/// has all its markers and ends with FF D9, but its scan hits that marker before the last MCU: the criterion is the
/// one libjpeg warns about as "premature end of data segment" (a marker met while the entropy decoder still needs
/// bits, ITU-T T.81 F.2.2.5 and B.1.1.5). Decoding follows T.81 F.2.2.3 (DECODE with MINCODE/MAXCODE/VALPTR) and
/// F.2.2.1/F.2.2.2 (DC difference and AC run/size symbols); restart intervals (DRI, RSTm) are followed.
/// Progressive and arithmetic-coded files are left to the end-of-image check.
/// </summary>
internal static class JpegScanCheck
{
    private const int Unchecked = -1;

    /// <summary>A sentence saying what is missing, or null when every scan holds every block it must.</summary>
    public static string? FindProblem(byte[] data)
    {
        ArgumentNullException.ThrowIfNull(data);
        var dc = new HuffmanTable?[4];
        var ac = new HuffmanTable?[4];
        Frame? frame = null;
        int restartInterval = 0;
        var scanned = new HashSet<int>();
        int at = 2; // after SOI
        if (data.Length < 4 || data[0] != 0xFF || data[1] != 0xD8)
        {
            return "the JPEG file does not start with a start-of-image marker";
        }
        while (true)
        {
            // Markers may be preceded by any number of fill bytes 0xFF (T.81 B.1.1.2).
            while (at < data.Length && data[at] == 0xFF && at + 1 < data.Length && data[at + 1] == 0xFF)
            {
                at++;
            }
            if (at + 1 >= data.Length || data[at] != 0xFF)
            {
                return "the JPEG marker structure is broken at byte " + at.ToString("N0", System.Globalization.CultureInfo.InvariantCulture) + " (truncated or damaged)";
            }
            byte marker = data[at + 1];
            at += 2;
            if (marker == 0xD9)
            {
                break;
            }
            if (marker is >= 0xD0 and <= 0xD7 or 0x01)
            {
                continue; // stand-alone markers
            }
            if (at + 2 > data.Length)
            {
                return "the JPEG file ends inside a marker segment (truncated)";
            }
            int length = BinaryPrimitives.ReadUInt16BigEndian(data.AsSpan(at));
            if (length < 2 || at + length > data.Length)
            {
                return "a JPEG marker segment runs past the end of the file (truncated)";
            }
            ReadOnlySpan<byte> segment = data.AsSpan(at + 2, length - 2);
            switch (marker)
            {
                case 0xC0 or 0xC1:
                    frame = Frame.Read(segment);
                    if (frame is null)
                    {
                        return "the JPEG frame header is damaged";
                    }
                    break;
                case >= 0xC2 and <= 0xCF when marker is not 0xC4 and not 0xC8 and not 0xCC:
                    return null; // progressive, lossless or arithmetic coding: not walked here
                case 0xC4:
                    if (!HuffmanTable.ReadAll(segment, dc, ac))
                    {
                        return "a JPEG Huffman table is damaged";
                    }
                    break;
                case 0xDD:
                    restartInterval = segment.Length >= 2 ? BinaryPrimitives.ReadUInt16BigEndian(segment) : 0;
                    break;
                case 0xDA:
                    if (frame is null)
                    {
                        return "a JPEG scan comes before its frame header";
                    }
                    int end = at + length;
                    string? problem = WalkScan(data, ref end, segment, frame, dc, ac, restartInterval, scanned);
                    if (problem is not null)
                    {
                        return problem;
                    }
                    at = end;
                    continue;
            }
            at += length;
        }
        if (frame is null)
        {
            return null;
        }
        foreach (Component c in frame.Components)
        {
            if (!scanned.Contains(c.Id))
            {
                return $"JPEG component {c.Id} is in no scan (truncated)";
            }
        }
        return null;
    }

    private static string? WalkScan(byte[] data, ref int at, ReadOnlySpan<byte> header, Frame frame, HuffmanTable?[] dc, HuffmanTable?[] ac,
        int restartInterval, HashSet<int> scanned)
    {
        int ns = header.Length > 0 ? header[0] : 0;
        if (ns is < 1 or > 4 || header.Length < 1 + (2 * ns) + 3)
        {
            return "a JPEG scan header is damaged";
        }
        var components = new Component[ns];
        var dcTables = new HuffmanTable[ns];
        var acTables = new HuffmanTable[ns];
        for (int i = 0; i < ns; i++)
        {
            int id = header[1 + (2 * i)];
            int tables = header[2 + (2 * i)];
            Component? c = Array.Find(frame.Components, x => x.Id == id);
            HuffmanTable? d = dc[(tables >> 4) & 3];
            HuffmanTable? a = ac[tables & 3];
            if (c is null || d is null || a is null)
            {
                return "a JPEG scan names a component or Huffman table that is not defined";
            }
            components[i] = c;
            dcTables[i] = d;
            acTables[i] = a;
            scanned.Add(id);
        }
        long mcus;
        if (ns == 1)
        {
            // Non-interleaved: one block per MCU over the component's own size (T.81 A.2.2).
            Component c = components[0];
            long w = (((long)frame.Width * c.H) + frame.MaxH - 1) / frame.MaxH;
            long h = (((long)frame.Height * c.V) + frame.MaxV - 1) / frame.MaxV;
            mcus = ((w + 7) / 8) * ((h + 7) / 8);
        }
        else
        {
            mcus = (((long)frame.Width + (8 * frame.MaxH) - 1) / (8 * frame.MaxH)) * (((long)frame.Height + (8 * frame.MaxV) - 1) / (8 * frame.MaxV));
        }
        var reader = new BitReader(data, at);
        for (long m = 0; m < mcus; m++)
        {
            if (restartInterval > 0 && m > 0 && m % restartInterval == 0 && !reader.Restart())
            {
                return Cut(m, mcus);
            }
            for (int i = 0; i < ns; i++)
            {
                int blocks = ns == 1 ? 1 : components[i].H * components[i].V;
                for (int b = 0; b < blocks; b++)
                {
                    if (!Block(ref reader, dcTables[i], acTables[i]))
                    {
                        return reader.HitMarker ? Cut(m, mcus) : "the JPEG scan data is damaged (no Huffman code matches)";
                    }
                }
            }
        }
        at = reader.NextMarker();
        return null;
    }

    private static string Cut(long done, long total) => string.Create(System.Globalization.CultureInfo.InvariantCulture,
        $"the JPEG scan data ends after {done:N0} of {total:N0} MCUs: a marker follows too early (truncated, an end marker appended)");

    /// <summary>Skips one 8×8 block: DC size and bits, then AC run/size symbols up to EOB or the 63rd coefficient.</summary>
    private static bool Block(ref BitReader reader, HuffmanTable dc, HuffmanTable ac)
    {
        int s = dc.Decode(ref reader);
        if (s < 0 || s > 16 || !reader.Skip(s))
        {
            return false;
        }
        for (int k = 1; k < 64;)
        {
            int rs = ac.Decode(ref reader);
            if (rs < 0)
            {
                return false;
            }
            int r = rs >> 4;
            s = rs & 15;
            if (s == 0)
            {
                if (r != 15)
                {
                    break; // EOB
                }
                k += 16;
                continue;
            }
            k += r + 1;
            if (!reader.Skip(s))
            {
                return false;
            }
        }
        return true;
    }

    private sealed record Component(int Id, int H, int V);

    private sealed record Frame(int Width, int Height, Component[] Components, int MaxH, int MaxV)
    {
        public static Frame? Read(ReadOnlySpan<byte> s)
        {
            if (s.Length < 6)
            {
                return null;
            }
            int height = BinaryPrimitives.ReadUInt16BigEndian(s[1..]);
            int width = BinaryPrimitives.ReadUInt16BigEndian(s[3..]);
            int n = s[5];
            if (n < 1 || s.Length < 6 + (3 * n) || width == 0 || height == 0)
            {
                return null; // height 0 (set later by a DNL marker) is not walked either
            }
            var components = new Component[n];
            int maxH = 1;
            int maxV = 1;
            for (int i = 0; i < n; i++)
            {
                int h = s[7 + (3 * i)] >> 4;
                int v = s[7 + (3 * i)] & 15;
                if (h is < 1 or > 4 || v is < 1 or > 4)
                {
                    return null;
                }
                components[i] = new Component(s[6 + (3 * i)], h, v);
                maxH = Math.Max(maxH, h);
                maxV = Math.Max(maxV, v);
            }
            return new Frame(width, height, components, maxH, maxV);
        }
    }

    /// <summary>A Huffman table in T.81 Annex F.2.2.3 form: MAXCODE, VALPTR and MINCODE per code length.</summary>
    private sealed class HuffmanTable
    {
        private readonly int[] _maxCode = new int[17];
        private readonly int[] _valPtr = new int[17];
        private readonly int[] _minCode = new int[17];
        private readonly byte[] _values;

        private HuffmanTable(ReadOnlySpan<byte> counts, ReadOnlySpan<byte> values)
        {
            _values = values.ToArray();
            int code = 0;
            int k = 0;
            for (int l = 1; l <= 16; l++)
            {
                int n = counts[l - 1];
                if (n == 0)
                {
                    _maxCode[l] = Unchecked;
                }
                else
                {
                    _valPtr[l] = k;
                    _minCode[l] = code;
                    code += n;
                    k += n;
                    _maxCode[l] = code - 1;
                }
                code <<= 1;
            }
        }

        public static bool ReadAll(ReadOnlySpan<byte> s, HuffmanTable?[] dc, HuffmanTable?[] ac)
        {
            while (s.Length > 0)
            {
                if (s.Length < 17)
                {
                    return false;
                }
                int cls = s[0] >> 4;
                int id = s[0] & 15;
                ReadOnlySpan<byte> counts = s.Slice(1, 16);
                int total = 0;
                foreach (byte c in counts)
                {
                    total += c;
                }
                if (cls > 1 || id > 3 || total > 256 || s.Length < 17 + total)
                {
                    return false;
                }
                var table = new HuffmanTable(counts, s.Slice(17, total));
                (cls == 0 ? dc : ac)[id] = table;
                s = s[(17 + total)..];
            }
            return true;
        }

        /// <summary>The next symbol, or −1 when the bits run out (a marker) or no code matches.</summary>
        public int Decode(ref BitReader reader)
        {
            int code = 0;
            for (int l = 1; l <= 16; l++)
            {
                int bit = reader.Bit();
                if (bit < 0)
                {
                    return -1;
                }
                code = (code << 1) | bit;
                if (_maxCode[l] != Unchecked && code <= _maxCode[l])
                {
                    return _values[_valPtr[l] + code - _minCode[l]];
                }
            }
            return -1;
        }
    }

    /// <summary>Bits of entropy-coded data, MSB first, with byte stuffing (FF 00) removed; stops at any marker.</summary>
    private ref struct BitReader(byte[] data, int start)
    {
        private readonly byte[] _data = data;
        private int _at = start;
        private int _byte;
        private int _bitsLeft;

        public bool HitMarker { get; private set; }

        public int Bit()
        {
            if (_bitsLeft == 0)
            {
                if (_at >= _data.Length)
                {
                    HitMarker = true;
                    return -1;
                }
                int b = _data[_at];
                if (b == 0xFF)
                {
                    if (_at + 1 >= _data.Length || _data[_at + 1] != 0x00)
                    {
                        HitMarker = true;
                        return -1;
                    }
                    _at += 2;
                }
                else
                {
                    _at++;
                }
                _byte = b;
                _bitsLeft = 8;
            }
            _bitsLeft--;
            return (_byte >> _bitsLeft) & 1;
        }

        public bool Skip(int bits)
        {
            for (int i = 0; i < bits; i++)
            {
                if (Bit() < 0)
                {
                    return false;
                }
            }
            return true;
        }

        /// <summary>At a restart interval's end: drop the padding bits and step over the RSTm marker; false if another marker stands there.</summary>
        public bool Restart()
        {
            _bitsLeft = 0;
            int at = NextMarker();
            if (at + 1 < _data.Length && _data[at] == 0xFF && _data[at + 1] is >= 0xD0 and <= 0xD7)
            {
                _at = at + 2;
                return true;
            }
            HitMarker = true;
            return false;
        }

        /// <summary>Position of the next marker (an FF not followed by 00).</summary>
        public readonly int NextMarker()
        {
            int at = _at;
            while (at + 1 < _data.Length && !(_data[at] == 0xFF && _data[at + 1] != 0x00))
            {
                at += _data[at] == 0xFF ? 2 : 1;
            }
            return at;
        }
    }
}
