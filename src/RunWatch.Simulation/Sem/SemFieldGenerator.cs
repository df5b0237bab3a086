namespace RunWatch.Simulation.Sem;

/// <summary>
/// Draws a synthetic top-down SEM field of nanowires (invented data): hexagonal bright tops with a brighter
/// droplet at the given sites, some tilted wires seen side-on, parasitic clusters, a background gradient,
/// Gaussian noise and an information strip at the bottom. Edges are anti-aliased by 4 × 4 supersampling.
/// Deterministic from <see cref="SemFieldSpec.Seed"/>.
/// </summary>
public static class SemFieldGenerator
{
    private const int Sub = 4;

    public static SemField Generate(SemFieldSpec spec)
    {
        ArgumentNullException.ThrowIfNull(spec);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(spec.Width);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(spec.Height);
        int w = spec.Width, h = spec.Height;
        var signal = new float[w * h];
        var random = new Random(spec.Seed);
        var objects = new List<SemObject>(spec.Sites.Count + 16);

        for (int i = 0; i < spec.Sites.Count; i++)
        {
            (double x, double y) = spec.Sites[i];
            double a = spec.SideOfSite(i);
            double angle = random.NextDouble() * 60;
            if (random.NextDouble() < spec.TiltedFraction)
            {
                double length = a * (3 + 3 * random.NextDouble());
                double direction = random.NextDouble() * 360;
                objects.Add(new SemObject(SemObjectKind.Tilted, x, y, 0.8 * a, length, direction));
            }
            else
            {
                objects.Add(new SemObject(SemObjectKind.Vertical, x, y, a, 0, angle));
            }
        }
        int parasites = (int)Math.Round(spec.Sites.Count * spec.ParasiticPerThousandSites / 1000.0);
        double meanSide = spec.Sites.Count > 0 ? spec.SideOfSite(0) : 8;
        for (int p = 0; p < parasites; p++)
        {
            double x = random.NextDouble() * w;
            double y = random.NextDouble() * Math.Max(1, h - spec.InfoStripRows);
            objects.Add(new SemObject(SemObjectKind.Parasitic, x, y, 2.2 * meanSide, 0, random.NextDouble() * 360));
        }

        int parasiteIndex = 0;
        foreach (SemObject o in objects)
        {
            switch (o.Kind)
            {
                case SemObjectKind.Vertical:
                    DrawVertical(signal, w, h, o, spec);
                    break;
                case SemObjectKind.Tilted:
                    DrawTilted(signal, w, h, o, spec);
                    break;
                default:
                    DrawParasite(signal, w, h, o, spec, new Random(Mix(spec.Seed, parasiteIndex++)));
                    break;
            }
        }

        var pixels = new ushort[w * h];
        int stripTop = h - Math.Clamp(spec.InfoStripRows, 0, h);
        Parallel.For(0, h, y =>
        {
            var noise = new Random(Mix(spec.Seed, 1_000_000 + y));
            for (int x = 0; x < w; x++)
            {
                double gx = (double)x / w, gy = (double)y / h;
                double background = spec.Background + spec.GradientAmplitude * (0.6 * gx + 0.4 * gy + 0.5 * Math.Sin(Math.PI * gx) * gy);
                double v = background + signal[y * w + x] + spec.NoiseSigma * Gaussian(noise);
                pixels[y * w + x] = (ushort)Math.Clamp(Math.Round(v), 0, ushort.MaxValue);
            }
        });
        if (stripTop < h)
        {
            DrawInfoStrip(pixels, w, h, stripTop);
        }
        return new SemField(w, h, pixels, objects, h - stripTop, spec.PixelSizeNm);
    }

    /// <summary>A fixed integer mix (SplitMix64 finaliser) for per-row and per-object seeds; HashCode is randomised per process.</summary>
    private static int Mix(int seed, int index)
    {
        ulong z = ((ulong)(uint)seed << 32 | (uint)index) + 0x9E3779B97F4A7C15UL;
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
        return (int)(z ^ (z >> 31));
    }

    private static double Gaussian(Random r)
    {
        double u1 = 1.0 - r.NextDouble();
        double u2 = r.NextDouble();
        return Math.Sqrt(-2 * Math.Log(u1)) * Math.Cos(2 * Math.PI * u2);
    }

    private static void DrawVertical(float[] signal, int w, int h, SemObject o, SemFieldSpec spec)
    {
        double a = o.Size;
        double apothem = a * Math.Sqrt(3) / 2;
        double theta = o.AngleDeg * Math.PI / 180;
        var nx = new double[3];
        var ny = new double[3];
        for (int k = 0; k < 3; k++)
        {
            nx[k] = Math.Cos(theta + k * Math.PI / 3);
            ny[k] = Math.Sin(theta + k * Math.PI / 3);
        }
        double droplet = 0.5 * a;
        Cover(signal, w, h, o.X, o.Y, a + 1, (dx, dy) =>
        {
            for (int k = 0; k < 3; k++)
            {
                if (Math.Abs(dx * nx[k] + dy * ny[k]) > apothem)
                {
                    return 0;
                }
            }
            return dx * dx + dy * dy <= droplet * droplet ? spec.TopBrightness + spec.DropletBrightness : spec.TopBrightness;
        });
    }

    private static void DrawTilted(float[] signal, int w, int h, SemObject o, SemFieldSpec spec)
    {
        double r = o.Size;
        double phi = o.AngleDeg * Math.PI / 180;
        double ux = Math.Cos(phi), uy = Math.Sin(phi);
        double half = o.Length / 2;
        Cover(signal, w, h, o.X, o.Y, half + r + 1, (dx, dy) =>
        {
            double t = Math.Clamp(dx * ux + dy * uy, -half, half);
            double ex = dx - t * ux, ey = dy - t * uy;
            if (ex * ex + ey * ey > r * r)
            {
                return 0;
            }
            double tipX = dx - half * ux, tipY = dy - half * uy;
            double shade = spec.TopBrightness * (0.75 + 0.25 * (t + half) / (2 * half));
            return tipX * tipX + tipY * tipY <= r * r ? shade + spec.DropletBrightness : shade;
        });
    }

    private static void DrawParasite(float[] signal, int w, int h, SemObject o, SemFieldSpec spec, Random random)
    {
        int lobes = 3 + random.Next(3);
        Span<double> lx = stackalloc double[lobes];
        Span<double> ly = stackalloc double[lobes];
        Span<double> lr = stackalloc double[lobes];
        for (int k = 0; k < lobes; k++)
        {
            double angle = random.NextDouble() * 2 * Math.PI;
            double dist = random.NextDouble() * 0.6 * o.Size;
            lx[k] = dist * Math.Cos(angle);
            ly[k] = dist * Math.Sin(angle);
            lr[k] = (0.25 + 0.25 * random.NextDouble()) * o.Size;
        }
        double[] x = lx.ToArray(), y = ly.ToArray(), rr = lr.ToArray();
        Cover(signal, w, h, o.X, o.Y, o.Size + 1, (dx, dy) =>
        {
            for (int k = 0; k < x.Length; k++)
            {
                double ex = dx - x[k], ey = dy - y[k];
                if (ex * ex + ey * ey <= rr[k] * rr[k])
                {
                    return 0.85 * spec.TopBrightness;
                }
            }
            return 0;
        });
    }

    /// <summary>Supersamples <paramref name="brightness"/> over the box of half-size <paramref name="reach"/> and keeps the brighter of old and new.</summary>
    private static void Cover(float[] signal, int w, int h, double cx, double cy, double reach, Func<double, double, double> brightness)
    {
        int x0 = Math.Max(0, (int)Math.Floor(cx - reach)), x1 = Math.Min(w - 1, (int)Math.Ceiling(cx + reach));
        int y0 = Math.Max(0, (int)Math.Floor(cy - reach)), y1 = Math.Min(h - 1, (int)Math.Ceiling(cy + reach));
        for (int y = y0; y <= y1; y++)
        {
            for (int x = x0; x <= x1; x++)
            {
                double sum = 0;
                for (int sy = 0; sy < Sub; sy++)
                {
                    double py = y + (sy + 0.5) / Sub - cy;
                    for (int sx = 0; sx < Sub; sx++)
                    {
                        sum += brightness(x + (sx + 0.5) / Sub - cx, py);
                    }
                }
                float v = (float)(sum / (Sub * Sub));
                int i = y * w + x;
                if (v > signal[i])
                {
                    signal[i] = v;
                }
            }
        }
    }

    /// <summary>A flat strip with a separator line, blocks standing for text, and a scale bar: the kind of band instruments print.</summary>
    private static void DrawInfoStrip(ushort[] pixels, int w, int h, int top)
    {
        const ushort Fill = 2500, Ink = 60000;
        pixels.AsSpan(top * w, (h - top) * w).Fill(Fill);
        pixels.AsSpan(top * w, w).Fill(Ink);
        int rows = h - top;
        int textTop = top + Math.Max(2, rows / 4);
        int textBottom = Math.Min(h - 1, textTop + Math.Max(2, rows / 3));
        for (int y = textTop; y <= textBottom; y++)
        {
            for (int x = 8; x < w / 3; x += 9)
            {
                for (int k = 0; k < 5 && x + k < w; k++)
                {
                    pixels[y * w + x + k] = Ink;
                }
            }
        }
        int barY = Math.Min(h - 2, textBottom + 2);
        for (int y = barY; y < Math.Min(h, barY + 3); y++)
        {
            pixels.AsSpan(y * w + w / 2, Math.Min(w / 5, w - w / 2)).Fill(Ink);
        }
    }
}
