using MathNet.Numerics.Distributions;
using RunWatch.Core.Model;

namespace RunWatch.Core.Tests.Model;

/// <summary>Seeded synthetic wafers: Â drawn like capture areas, radii from a known model plus Gaussian noise.</summary>
internal static class SyntheticWafer
{
    /// <summary>
    /// Â from a gamma(shape 3.5, rate 3.5) scaled by 0.6 and capped at 1 (the capture area of a wire cannot exceed
    /// its disc); the gamma shape follows Járai-Szabó &amp; Néda (2007) for Poisson–Voronoi cell sizes.
    /// </summary>
    public static (double[] Areas, double[] Radii) Make(RadiusModelKind kind, double first, double second, double noiseSdNm, int wires, int seed)
    {
        var random = new Random(seed);
        var gamma = new Gamma(3.5, 3.5, random);
        var noise = new Normal(0, noiseSdNm, random);
        var areas = new double[wires];
        var radii = new double[wires];
        for (int i = 0; i < wires; i++)
        {
            areas[i] = Math.Clamp(0.6 * gamma.Sample(), 0.02, 1.0);
            double clean = kind == RadiusModelKind.Linear ? first + (second * areas[i]) : first * Math.Pow(areas[i], second);
            radii[i] = clean + noise.Sample();
        }
        return (areas, radii);
    }
}
