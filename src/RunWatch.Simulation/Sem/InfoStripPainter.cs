namespace RunWatch.Simulation.Sem;

/// <summary>
/// Draws an information strip as instruments print them, in a layout of our own: a dark flat band with a bright
/// separator line towards the image, rows of text-like glyphs, a logo-like block and a scale bar with end ticks
/// (and a label above it). Glyphs are random 5 × 7 bit patterns: they look like text to a detector and read as nothing.
/// </summary>
internal static class InfoStripPainter
{
    private const ushort Fill = 1800;
    private const ushort Ink = 52000;

    /// <summary>Paints the strip; returns the scale bar's length in pixels.</summary>
    public static int Paint(ushort[] pixels, int w, int h, MicroscopeFieldSpec spec)
    {
        int rows = Math.Clamp(spec.StripRows, 0, h);
        int top = spec.StripAtTop ? 0 : h - rows;
        pixels.AsSpan(top * w, rows * w).Fill(Fill);
        int separator = spec.StripAtTop ? top + rows - 2 : top;
        pixels.AsSpan(separator * w, 2 * w).Fill(Ink);
        int inner = spec.StripAtTop ? top : top + 2;
        int innerRows = rows - 2;
        var random = new Random(MicroscopeFieldGenerator.Mix(spec.Seed, 6_000_000));
        int scale = Math.Max(1, innerRows / 24);
        int lineHeight = 9 * scale;

        // Two lines of text on the left third.
        for (int line = 0; line < 2 && ((line + 1) * lineHeight) + 2 < innerRows; line++)
        {
            int y = inner + 3 + (line * lineHeight);
            int x = 6 * scale;
            while (x + (6 * scale) < w * 0.38)
            {
                int word = 3 + random.Next(6);
                for (int c = 0; c < word && x + (6 * scale) < w * 0.38; c++)
                {
                    Glyph(pixels, w, h, x, y, scale, random);
                    x += 6 * scale;
                }
                x += 6 * scale;
            }
        }

        // Scale bar in the middle, its label above it.
        int bar = (int)Math.Round(spec.ScaleBarNm / spec.PixelSizeNm);
        if (bar < 4 || bar > w * 0.3)
        {
            throw new ArgumentOutOfRangeException(nameof(spec), $"the scale bar of {spec.ScaleBarNm} nm would be {bar} px; choose 4 px .. 30 % of the width");
        }
        int barX = (int)(w * 0.45);
        int thickness = Math.Max(2, innerRows / 12);
        int barY = inner + innerRows - thickness - Math.Max(2, innerRows / 6);
        for (int y = barY; y < barY + thickness; y++)
        {
            pixels.AsSpan((y * w) + barX, bar).Fill(Ink);
        }
        int tick = Math.Max(3, thickness * 2);
        for (int y = barY - tick + thickness; y < barY + thickness; y++)
        {
            if (y >= inner)
            {
                pixels[(y * w) + barX] = Ink;
                pixels[(y * w) + barX + bar - 1] = Ink;
            }
        }
        int labelY = barY - tick - (8 * scale);
        for (int c = 0; c < 6 && labelY >= inner; c++)
        {
            Glyph(pixels, w, h, barX + (bar / 2) - (18 * scale) + (c * 6 * scale), labelY, scale, random);
        }

        // A logo-like block at the right: a filled square with a ring cut out and a bar through it.
        int size = Math.Max(6, innerRows - 8);
        int lx = w - size - (8 * scale), ly = inner + ((innerRows - size) / 2);
        double c0 = (size - 1) / 2.0;
        for (int y = 0; y < size; y++)
        {
            for (int x = 0; x < size; x++)
            {
                double r = Math.Sqrt(((x - c0) * (x - c0)) + ((y - c0) * (y - c0)));
                bool ring = r > size * 0.28 && r < size * 0.38;
                bool stroke = Math.Abs(y - c0) < size * 0.06 && x > size * 0.2;
                if (!ring && !stroke && lx + x < w && ly + y < h)
                {
                    pixels[((ly + y) * w) + lx + x] = (ushort)(Ink - (x * 200));
                }
            }
        }
        return bar;
    }

    private static void Glyph(ushort[] pixels, int w, int h, int x0, int y0, int scale, Random random)
    {
        for (int row = 0; row < 7; row++)
        {
            int bits = random.Next(32);
            for (int col = 0; col < 5; col++)
            {
                if ((bits & (1 << col)) == 0)
                {
                    continue;
                }
                for (int sy = 0; sy < scale; sy++)
                {
                    for (int sx = 0; sx < scale; sx++)
                    {
                        int x = x0 + (col * scale) + sx, y = y0 + (row * scale) + sy;
                        if (x >= 0 && x < w && y >= 0 && y < h)
                        {
                            pixels[(y * w) + x] = Ink;
                        }
                    }
                }
            }
        }
    }
}
