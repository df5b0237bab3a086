namespace RunWatch.Simulation.Sem;

/// <summary>The relative SE yield of one drawn object at a sample-plane offset from its centre, NaN outside it.</summary>
internal sealed class ObjectShape
{
    private readonly MicroscopeObject _o;
    private readonly double _top;
    private readonly double _rim;
    private readonly double _rimWidth;
    private readonly double _dropletYield;
    private readonly double _maxGain;
    private readonly double[] _nx = new double[3];
    private readonly double[] _ny = new double[3];
    private readonly double _apothem;
    private readonly double[] _vertexAngle;
    private readonly double[] _facetShade;

    public ObjectShape(MicroscopeObject o, MicroscopeFieldSpec spec, int index)
    {
        _o = o;
        _top = spec.TopYield * o.BrightnessFactor;
        _rim = spec.RimYield;
        _rimWidth = Math.Max(1e-6, spec.RimWidthPx);
        _dropletYield = spec.DropletYield;
        _maxGain = spec.MaxSecantGain;
        double theta = o.AngleDeg * Math.PI / 180;
        for (int k = 0; k < 3; k++)
        {
            _nx[k] = Math.Cos(theta + (k * Math.PI / 3));
            _ny[k] = Math.Sin(theta + (k * Math.PI / 3));
        }
        _apothem = o.Size * Math.Sqrt(3) / 2;
        int n = o.Outline.Count;
        _vertexAngle = new double[n];
        _facetShade = new double[n];
        var random = new Random(MicroscopeFieldGenerator.Mix(spec.Seed, 5_000_000 + index));
        for (int i = 0; i < n; i++)
        {
            _vertexAngle[i] = Math.Atan2(o.Outline[i].Y, o.Outline[i].X);
            // Crystallite facets face different ways and so differ in brightness.
            _facetShade[i] = 1 + (0.3 * (random.NextDouble() - 0.5));
        }
    }

    public double Yield(double dx, double dy) => _o.Kind switch
    {
        SemObjectKind.Vertical => Vertical(dx, dy),
        SemObjectKind.Tilted => Tilted(dx, dy),
        _ => Crystallite(dx, dy),
    };

    private double Rim(double depth) => _rim > 0 ? _rim * Math.Exp(-depth / _rimWidth) : 0;

    private double Droplet(double rho2, double radius)
    {
        // Surface tilt α of a sphere seen from above: sin α = ρ/R; SE yield ∝ 1/cos α, capped.
        double c = Math.Sqrt(Math.Max(0, 1 - (rho2 / (radius * radius))));
        return _dropletYield * Math.Min(_maxGain, 1 / Math.Max(1e-9, c));
    }

    private double Vertical(double dx, double dy)
    {
        double r2 = (dx * dx) + (dy * dy);
        double rd = _o.DropletRadius;
        if (rd > 0 && r2 < rd * rd)
        {
            return Droplet(r2, rd);
        }
        double far = 0;
        for (int k = 0; k < 3; k++)
        {
            far = Math.Max(far, Math.Abs((dx * _nx[k]) + (dy * _ny[k])));
        }
        double depth = _apothem - far;
        return depth < 0 ? double.NaN : _top + Rim(depth);
    }

    private double Tilted(double dx, double dy)
    {
        double phi = _o.AngleDeg * Math.PI / 180;
        double ux = Math.Cos(phi), uy = Math.Sin(phi);
        double half = _o.Length / 2;
        double rd = _o.DropletRadius;
        if (rd > 0)
        {
            double tx = dx - ((half + (0.5 * rd)) * ux), ty = dy - ((half + (0.5 * rd)) * uy);
            if ((tx * tx) + (ty * ty) < rd * rd)
            {
                return Droplet((tx * tx) + (ty * ty), rd);
            }
        }
        double t = Math.Clamp((dx * ux) + (dy * uy), -half, half);
        double ex = dx - (t * ux), ey = dy - (t * uy);
        double depth = _o.Size - Math.Sqrt((ex * ex) + (ey * ey));
        if (depth < 0)
        {
            return double.NaN;
        }
        // The side wall faces the detector more towards the tip.
        return (_top * (0.75 + (0.25 * (t + half) / Math.Max(1e-9, 2 * half)))) + Rim(depth);
    }

    private double Crystallite(double dx, double dy)
    {
        int n = _vertexAngle.Length;
        if (n < 3)
        {
            return double.NaN;
        }
        double phi = Math.Atan2(dy, dx);
        // The outline is star-shaped about the centre with vertices in increasing angle: find the edge the ray crosses.
        int i = n - 1;
        for (int k = 0; k < n; k++)
        {
            if (_vertexAngle[k] <= phi)
            {
                i = k;
            }
        }
        if (phi < _vertexAngle[0])
        {
            i = n - 1;
        }
        var a = _o.Outline[i];
        var b = _o.Outline[(i + 1) % n];
        double ex = b.X - a.X, ey = b.Y - a.Y;
        double len = Math.Sqrt((ex * ex) + (ey * ey));
        double nx = ey / len, ny = -ex / len;
        double offset = (nx * a.X) + (ny * a.Y);
        if (offset < 0)
        {
            nx = -nx;
            ny = -ny;
            offset = -offset;
        }
        double depth = offset - ((nx * dx) + (ny * dy));
        return depth < 0 ? double.NaN : (_top * _facetShade[i]) + Rim(depth);
    }
}
