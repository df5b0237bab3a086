using RunWatch.Imaging.Decoding;

namespace RunWatch.Imaging.Tests.Support;

/// <summary>Binary test shapes drawn by pixel-centre inclusion: pixel (x, y) is inside when (x + 0.5, y + 0.5) is.</summary>
internal static class Shapes
{
    public const ushort Bright = 40000;

    /// <summary>Regular hexagon of side <paramref name="a"/>, centre (cx, cy), face normals at θ + k·60°.</summary>
    public static bool InHexagon(double px, double py, double cx, double cy, double a, double thetaDeg)
    {
        double apothem = a * Math.Sqrt(3) / 2;
        double t = thetaDeg * Math.PI / 180;
        for (int k = 0; k < 3; k++)
        {
            double nx = Math.Cos(t + k * Math.PI / 3), ny = Math.Sin(t + k * Math.PI / 3);
            if (Math.Abs((px - cx) * nx + (py - cy) * ny) > apothem)
            {
                return false;
            }
        }
        return true;
    }

    public static GrayImage Draw(int w, int h, Func<double, double, bool> inside)
    {
        var pixels = new ushort[w * h];
        for (int y = 0; y < h; y++)
        {
            for (int x = 0; x < w; x++)
            {
                if (inside(x + 0.5, y + 0.5))
                {
                    pixels[y * w + x] = Bright;
                }
            }
        }
        return new GrayImage(w, h, pixels);
    }
}
