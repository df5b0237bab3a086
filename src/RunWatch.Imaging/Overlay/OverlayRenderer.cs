using System.Globalization;
using RunWatch.Imaging.Analysis;
using RunWatch.Imaging.Measurement;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Formats.Png;
using SixLabors.ImageSharp.PixelFormats;

namespace RunWatch.Imaging.Overlay;

/// <summary>
/// Draws an overlay PNG: the field in grey (contrast stretched between its 1st and 99th percentiles), wire
/// outlines coloured by class, edge-based capture-zone boundaries when the raster kept them, the excluded band
/// shaded, a scale bar and a legend, all drawn here pixel by pixel.
/// </summary>
public static class OverlayRenderer
{
    /// <summary>Outline colours per class, and for objects touching the border.</summary>
    public static readonly IReadOnlyDictionary<WireClass, (byte R, byte G, byte B)> ClassColours = new Dictionary<WireClass, (byte, byte, byte)>
    {
        [WireClass.Vertical] = (40, 220, 60),
        [WireClass.Elongated] = (255, 160, 0),
        [WireClass.Oversized] = (230, 40, 230),
        [WireClass.Irregular] = (240, 40, 40),
    };

    public static readonly (byte R, byte G, byte B) BorderColour = (90, 140, 255);

    public static readonly (byte R, byte G, byte B) ZoneColour = (0, 200, 210);

    /// <summary>Renders into an RGB buffer (3 bytes per pixel, row-major).</summary>
    public static byte[] Render(FieldAnalysis analysis, FieldRaster raster)
    {
        ArgumentNullException.ThrowIfNull(analysis);
        ArgumentNullException.ThrowIfNull(raster);
        int w = raster.Image.Width, h = raster.Image.Height;
        var rgb = new byte[w * h * 3];
        (double lo, double hi) = Stretch(raster.Image.Pixels);
        ushort[] px = raster.Image.Pixels;
        Parallel.For(0, h, y =>
        {
            for (int x = 0; x < w; x++)
            {
                int i = y * w + x;
                byte g = (byte)Math.Clamp((px[i] - lo) / (hi - lo) * 255, 0, 255);
                if (y >= raster.ValidHeight)
                {
                    g = (byte)(g / 3 + 40);
                }
                rgb[3 * i] = g;
                rgb[3 * i + 1] = g;
                rgb[3 * i + 2] = g;
            }
        });

        int[] labels = raster.Labels;
        if (raster.ZoneMap is { } zones)
        {
            for (int y = 0; y < raster.ValidHeight; y++)
            {
                for (int x = 0; x < w; x++)
                {
                    int i = y * w + x;
                    if (labels[i] != 0)
                    {
                        continue;
                    }
                    bool edge = (x + 1 < w && zones[i + 1] != zones[i] && labels[i + 1] == 0)
                        || (y + 1 < raster.ValidHeight && zones[i + w] != zones[i] && labels[i + w] == 0);
                    if (edge)
                    {
                        Put(rgb, i, ZoneColour);
                    }
                }
            }
        }

        var colourOf = new (byte, byte, byte)[analysis.Wires.Count + 1];
        foreach (WireMeasurement wire in analysis.Wires)
        {
            colourOf[wire.Id] = wire.TouchesBorder ? BorderColour : ClassColours[wire.Class];
        }
        for (int y = 0; y < h; y++)
        {
            for (int x = 0; x < w; x++)
            {
                int i = y * w + x;
                int l = labels[i];
                if (l == 0 || l >= colourOf.Length)
                {
                    continue;
                }
                bool boundary = x == 0 || y == 0 || x == w - 1 || y == h - 1
                    || labels[i - 1] != l || labels[i + 1] != l || labels[i - w] != l || labels[i + w] != l;
                if (boundary)
                {
                    Put(rgb, i, colourOf[l]);
                }
            }
        }

        int scale = Math.Max(1, Math.Min(w, h) / 400);
        DrawLegend(rgb, w, h, analysis, scale);
        DrawScaleBar(rgb, w, h, raster.ValidHeight, analysis, scale);
        return rgb;
    }

    /// <summary>Renders and writes a PNG.</summary>
    public static void Write(FieldAnalysis analysis, FieldRaster raster, string path)
    {
        byte[] rgb = Render(analysis, raster);
        using var image = Image.LoadPixelData<Rgb24>(rgb, raster.Image.Width, raster.Image.Height);
        image.SaveAsPng(path, new PngEncoder { CompressionLevel = PngCompressionLevel.BestSpeed });
    }

    internal static (double Lo, double Hi) Stretch(ushort[] pixels)
    {
        var histogram = new long[65536];
        int step = Math.Max(1, pixels.Length / 500_000);
        long n = 0;
        for (int i = 0; i < pixels.Length; i += step)
        {
            histogram[pixels[i]]++;
            n++;
        }
        double lo = Quantile(histogram, n, 0.01), hi = Quantile(histogram, n, 0.99);
        return hi > lo ? (lo, hi) : (lo, lo + 1);
    }

    private static double Quantile(long[] histogram, long n, double q)
    {
        long target = (long)(q * n), seen = 0;
        for (int v = 0; v < histogram.Length; v++)
        {
            seen += histogram[v];
            if (seen > target)
            {
                return v;
            }
        }
        return histogram.Length - 1;
    }

    private static void DrawLegend(byte[] rgb, int w, int h, FieldAnalysis a, int s)
    {
        FieldStatistics st = a.Statistics;
        var rows = new List<(string Text, (byte, byte, byte) Colour)>
        {
            ($"VERTICAL {st.Vertical}", ClassColours[WireClass.Vertical]),
            ($"ELONGATED {st.Elongated}", ClassColours[WireClass.Elongated]),
            ($"OVERSIZED {st.Oversized}", ClassColours[WireClass.Oversized]),
            ($"IRREGULAR {st.Irregular}", ClassColours[WireClass.Irregular]),
            ($"AT BORDER {st.ObjectsTouchingBorder}", BorderColour),
        };
        if (st.DiffusionLength is not null)
        {
            rows.Add(("ZONE EDGE", ZoneColour));
        }
        int line = (BitmapFont.GlyphHeight + 3) * s;
        int boxW = 4 * s + 10 * s + rows.Max(r => BitmapFont.Measure(r.Text, s));
        int boxH = rows.Count * line + 4 * s;
        FillRect(rgb, w, h, 2 * s, 2 * s, boxW, boxH, (0, 0, 0));
        for (int k = 0; k < rows.Count; k++)
        {
            int y = 4 * s + k * line;
            FillRect(rgb, w, h, 4 * s, y, 7 * s, 7 * s, rows[k].Colour);
            DrawText(rgb, w, h, rows[k].Text, 14 * s, y, s, (255, 255, 255));
        }
    }

    private static void DrawScaleBar(byte[] rgb, int w, int h, int validHeight, FieldAnalysis a, int s)
    {
        double unitPerPixel = a.Scale.PixelSizeNm ?? 1;
        double target = w / 5.0 * unitPerPixel;
        double magnitude = Math.Pow(10, Math.Floor(Math.Log10(target)));
        double nice = target / magnitude >= 5 ? 5 * magnitude : target / magnitude >= 2 ? 2 * magnitude : magnitude;
        int barPx = Math.Max(1, (int)Math.Round(nice / unitPerPixel));
        string label = !a.Scale.HasScale
            ? nice.ToString("0", CultureInfo.InvariantCulture) + " px"
            : nice >= 1000 ? (nice / 1000).ToString("0.###", CultureInfo.InvariantCulture) + " µm" : nice.ToString("0", CultureInfo.InvariantCulture) + " nm";
        int textW = BitmapFont.Measure(label, s);
        int boxW = Math.Max(barPx, textW) + 8 * s;
        int boxH = (BitmapFont.GlyphHeight + 12) * s;
        int x0 = 2 * s, y0 = Math.Max(0, validHeight - boxH - 2 * s);
        FillRect(rgb, w, h, x0, y0, boxW, boxH, (0, 0, 0));
        FillRect(rgb, w, h, x0 + 4 * s, y0 + 3 * s, barPx, 3 * s, (255, 255, 255));
        DrawText(rgb, w, h, label, x0 + 4 * s, y0 + 9 * s, s, (255, 255, 255));
    }

    private static void DrawText(byte[] rgb, int w, int h, string text, int x0, int y0, int s, (byte, byte, byte) colour)
    {
        for (int c = 0; c < text.Length; c++)
        {
            for (int row = 0; row < BitmapFont.GlyphHeight; row++)
            {
                for (int col = 0; col < BitmapFont.GlyphWidth; col++)
                {
                    if (BitmapFont.Ink(text[c], col, row))
                    {
                        FillRect(rgb, w, h, x0 + (c * BitmapFont.Advance + col) * s, y0 + row * s, s, s, colour);
                    }
                }
            }
        }
    }

    private static void FillRect(byte[] rgb, int w, int h, int x0, int y0, int rw, int rh, (byte, byte, byte) colour)
    {
        for (int y = Math.Max(0, y0); y < Math.Min(h, y0 + rh); y++)
        {
            for (int x = Math.Max(0, x0); x < Math.Min(w, x0 + rw); x++)
            {
                Put(rgb, y * w + x, colour);
            }
        }
    }

    private static void Put(byte[] rgb, int i, (byte R, byte G, byte B) c)
    {
        rgb[3 * i] = c.R;
        rgb[3 * i + 1] = c.G;
        rgb[3 * i + 2] = c.B;
    }
}
