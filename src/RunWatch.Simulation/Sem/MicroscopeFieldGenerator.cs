namespace RunWatch.Simulation.Sem;

/// <summary>
/// Images a scene the way a secondary-electron microscope makes a top-down field (invented data, a simplified
/// physical model, not any instrument's output):
/// 1. yield map: substrate 1 with a grain texture; wire tops <see cref="MicroscopeFieldSpec.TopYield"/> plus the
///    edge effect, a rim decaying as exp(−d/w) inside each edge; droplets brightening towards their rim as 1/cos α
///    (the secant law of SE yield with surface tilt α, Reimer, "Scanning Electron Microscopy", 2nd ed., 1998,
///    §4.3, FROM MEMORY); crystallites with facet shading. Edges are area-sampled (4 × 4 per pixel);
/// 2. Gaussian beam blur; 3. scan-line jitter (each row shifted by a random sub-pixel offset);
/// 4. charging drift of the gain over the frame time; 5. Poisson shot noise at the dose; 6. the information strip.
/// Truth (<see cref="MicroscopeObject"/>) is geometric and exact; nothing here depends on the analyser.
/// </summary>
public static class MicroscopeFieldGenerator
{
    private const int Sub = 4;
    private const double BlackLevel = 1500;
    private const double FullScale = 56000;
    private const double MaxRelativeSignal = 3.6;

    public static MicroscopeField Generate(MicroscopeFieldSpec spec)
    {
        ArgumentNullException.ThrowIfNull(spec);
        ArgumentOutOfRangeException.ThrowIfLessThan(spec.Width, 8);
        ArgumentOutOfRangeException.ThrowIfLessThan(spec.Height, 8);
        if (!(Math.Abs(spec.TiltDeg) < 80) || !(spec.PixelSizeNm > 0) || spec.DoseElectronsPerPixel < 0 || spec.BeamSigmaPx < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(spec), "tilt must lie within ±80°, pixel size > 0, dose and beam σ ≥ 0");
        }
        int w = spec.Width, h = spec.Height;
        var yield = new float[w * h];
        FillSubstrate(yield, spec);
        double cosTilt = Math.Cos(spec.TiltDeg * Math.PI / 180);
        int index = 0;
        foreach (MicroscopeObject o in spec.Objects)
        {
            Draw(yield, w, h, o, spec, cosTilt, index++);
        }
        if (spec.BeamSigmaPx > 0)
        {
            GaussianBlur(yield, w, h, spec.BeamSigmaPx);
        }
        var pixels = new ushort[w * h];
        Detect(yield, pixels, spec);
        int bar = spec.StripRows > 0 ? InfoStripPainter.Paint(pixels, w, h, spec) : 0;
        return new MicroscopeField(spec, pixels, bar);
    }

    /// <summary>A fixed integer mix (SplitMix64 finaliser) for per-row seeds.</summary>
    internal static int Mix(int seed, int index)
    {
        ulong z = ((ulong)(uint)seed << 32 | (uint)index) + 0x9E3779B97F4A7C15UL;
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
        return (int)(z ^ (z >> 31));
    }

    internal static double Gaussian(Random r)
    {
        double u1 = 1.0 - r.NextDouble();
        double u2 = r.NextDouble();
        return Math.Sqrt(-2 * Math.Log(u1)) * Math.Cos(2 * Math.PI * u2);
    }

    private static void FillSubstrate(float[] yield, MicroscopeFieldSpec spec)
    {
        int w = spec.Width, h = spec.Height;
        if (spec.TextureFraction <= 0)
        {
            Array.Fill(yield, 1f);
            return;
        }
        Parallel.For(0, h, y =>
        {
            var random = new Random(Mix(spec.Seed, 2_000_000 + y));
            for (int x = 0; x < w; x++)
            {
                yield[y * w + x] = (float)Gaussian(random);
            }
        });
        GaussianBlur(yield, w, h, spec.TextureScalePx);
        double sum2 = 0;
        for (int i = 0; i < yield.Length; i++)
        {
            sum2 += yield[i] * (double)yield[i];
        }
        double scale = spec.TextureFraction / Math.Sqrt(Math.Max(1e-12, sum2 / yield.Length));
        for (int i = 0; i < yield.Length; i++)
        {
            yield[i] = (float)(1 + (scale * yield[i]));
        }
    }

    private static void Draw(float[] yield, int w, int h, MicroscopeObject o, MicroscopeFieldSpec spec, double cosTilt, int index)
    {
        double reach = o.Kind switch
        {
            SemObjectKind.Vertical => Math.Max(o.Size, o.DropletRadius) + 1,
            SemObjectKind.Tilted => (o.Length / 2) + o.Size + o.DropletRadius + 1,
            _ => o.Outline.Count == 0 ? 0 : o.Outline.Max(p => Math.Sqrt((p.X * p.X) + (p.Y * p.Y))) + 1,
        };
        int x0 = Math.Max(0, (int)Math.Floor(o.X - reach)), x1 = Math.Min(w - 1, (int)Math.Ceiling(o.X + reach));
        int y0 = Math.Max(0, (int)Math.Floor(o.Y - (reach * cosTilt))), y1 = Math.Min(h - 1, (int)Math.Ceiling(o.Y + (reach * cosTilt)));
        var shape = new ObjectShape(o, spec, index);
        for (int y = y0; y <= y1; y++)
        {
            for (int x = x0; x <= x1; x++)
            {
                int i = (y * w) + x;
                double old = yield[i];
                double sum = 0;
                for (int sy = 0; sy < Sub; sy++)
                {
                    // Sample-plane offset: the image's y is the plane's y foreshortened by cos θ.
                    double dy = (y + ((sy + 0.5) / Sub) - o.Y) / cosTilt;
                    for (int sx = 0; sx < Sub; sx++)
                    {
                        double v = shape.Yield(x + ((sx + 0.5) / Sub) - o.X, dy);
                        sum += double.IsNaN(v) ? old : v;
                    }
                }
                yield[i] = (float)(sum / (Sub * Sub));
            }
        }
    }

    /// <summary>Gain drift over the frame time, shot noise and the detector's linear scale to 16 bits.</summary>
    private static void Detect(float[] yield, ushort[] pixels, MicroscopeFieldSpec spec)
    {
        int w = spec.Width, h = spec.Height;
        double dose = spec.DoseElectronsPerPixel;
        double adu = FullScale / (MaxRelativeSignal * (dose > 0 ? dose : 1));
        double phase = new Random(Mix(spec.Seed, 3_000_001)).NextDouble() * 2 * Math.PI;
        Parallel.For(0, h, y =>
        {
            var random = new Random(Mix(spec.Seed, 4_000_000 + y));
            double jitter = spec.ScanJitterPx > 0 ? spec.ScanJitterPx * Gaussian(random) : 0;
            int row = y * w;
            for (int x = 0; x < w; x++)
            {
                // Scan-line jitter: the row was recorded with the beam shifted by `jitter` pixels.
                double sx = Math.Clamp(x + jitter, 0, w - 1);
                int xi = Math.Min(w - 2, (int)sx);
                double f = sx - xi;
                double s = w > 1 ? (yield[row + xi] * (1 - f)) + (yield[row + xi + 1] * f) : yield[row];
                double t = ((double)y * w + x) / ((double)w * h);
                double gain = 1 + (spec.DriftFraction * ((0.7 * Math.Sin((2 * Math.PI * 0.9 * t) + phase)) + (0.3 * ((2 * t) - 1))));
                double mean = s * gain * (dose > 0 ? dose : 1);
                double counts = dose > 0 ? Poisson(random, mean) : mean;
                pixels[row + x] = (ushort)Math.Clamp(Math.Round(BlackLevel + (adu * counts)), 0, ushort.MaxValue);
            }
        });
    }

    /// <summary>Knuth's multiplication method below λ = 30, a rounded normal N(λ, λ) above (COMMON PRACTICE).</summary>
    private static double Poisson(Random random, double lambda)
    {
        if (lambda <= 0)
        {
            return 0;
        }
        if (lambda >= 30)
        {
            return Math.Max(0, Math.Round(lambda + (Math.Sqrt(lambda) * Gaussian(random))));
        }
        double limit = Math.Exp(-lambda), p = 1;
        int k = 0;
        do
        {
            k++;
            p *= random.NextDouble();
        }
        while (p > limit);
        return k - 1;
    }

    /// <summary>Separable Gaussian blur in place, edges clamped.</summary>
    internal static void GaussianBlur(float[] data, int w, int h, double sigma)
    {
        int radius = Math.Max(1, (int)Math.Ceiling(3.5 * sigma));
        var kernel = new float[(2 * radius) + 1];
        double total = 0;
        for (int k = -radius; k <= radius; k++)
        {
            total += kernel[k + radius] = (float)Math.Exp(-(k * k) / (2 * sigma * sigma));
        }
        for (int k = 0; k < kernel.Length; k++)
        {
            kernel[k] = (float)(kernel[k] / total);
        }
        var temp = new float[data.Length];
        Parallel.For(0, h, y =>
        {
            int row = y * w;
            for (int x = 0; x < w; x++)
            {
                float s = 0;
                for (int k = -radius; k <= radius; k++)
                {
                    s += kernel[k + radius] * data[row + Math.Clamp(x + k, 0, w - 1)];
                }
                temp[row + x] = s;
            }
        });
        Parallel.For(0, h, y =>
        {
            int row = y * w;
            for (int x = 0; x < w; x++)
            {
                float s = 0;
                for (int k = -radius; k <= radius; k++)
                {
                    s += kernel[k + radius] * temp[(Math.Clamp(y + k, 0, h - 1) * w) + x];
                }
                data[row + x] = s;
            }
        });
    }
}
