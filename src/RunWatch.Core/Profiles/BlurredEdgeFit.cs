using MathNet.Numerics;
using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.Optimization;

namespace RunWatch.Core.Profiles;

/// <summary>
/// Least-squares fit of a blurred step with a bright rim to a sampled edge profile (inside at negative u):
/// f(u) = A·Φ(−x/σ) + B·E(x), x = u − δ, where the rim B·exp(−d/w) for depth d = −x &gt; 0 convolved with a
/// Gaussian gives E(x) = ½·exp(x/w + σ²/2w²)·erfc((x + σ²/w)/(σ√2)) (the exponentially modified Gaussian, DERIVED by
/// completing the square). A and B are linear and solved exactly for each trial (δ, σ, w); those three are found by
/// Nelder–Mead (MathNet.Numerics) over ln σ and ln w. Without a rim (B = 0) the half-maximum of A·Φ lies at δ.
/// </summary>
public static class BlurredEdgeFit
{
    /// <summary>Fits profile values <paramref name="y"/> at positions <paramref name="u"/> (NaN values are skipped).</summary>
    public static BlurredEdge Fit(ReadOnlySpan<double> u, ReadOnlySpan<double> y)
    {
        if (u.Length != y.Length)
        {
            throw new ArgumentException("positions and values differ in length");
        }
        double[] us = u.ToArray(), ys = y.ToArray();
        int n = 0;
        for (int i = 0; i < us.Length; i++)
        {
            if (double.IsFinite(us[i]) && double.IsFinite(ys[i]))
            {
                us[n] = us[i];
                ys[n] = ys[i];
                n++;
            }
        }
        if (n < 6)
        {
            throw new ArgumentException("at least 6 finite samples are needed");
        }
        Array.Resize(ref us, n);
        Array.Resize(ref ys, n);
        double Cost(Vector<double> p) => Solve(us, ys, p[0], Math.Exp(p[1]), Math.Exp(p[2])).Cost;
        var best = default(BlurredEdge);
        double bestCost = double.PositiveInfinity;
        // A few starts: the rim's width and the blur trade off on coarse profiles.
        foreach (double w0 in new[] { 0.7, 1.5, 3.0 })
        {
            var start = Vector<double>.Build.DenseOfArray([0, Math.Log(1.0), Math.Log(w0)]);
            var step = Vector<double>.Build.DenseOfArray([0.3, 0.3, 0.5]);
            MinimizationResult result;
            try
            {
                result = new NelderMeadSimplex(1e-10, 4000).FindMinimum(ObjectiveFunction.Value(Cost), start, step);
            }
            catch (MaximumIterationsException)
            {
                continue;
            }
            Vector<double> p = result.MinimizingPoint;
            (double cost, double a, double b) = Solve(us, ys, p[0], Math.Exp(p[1]), Math.Exp(p[2]));
            if (cost < bestCost)
            {
                bestCost = cost;
                best = new BlurredEdge(p[0], Math.Exp(p[1]), a, b, Math.Exp(p[2]), Math.Sqrt(cost / n));
            }
        }
        return best;
    }

    /// <summary>The model's value at <paramref name="u"/>.</summary>
    public static double Value(in BlurredEdge e, double u) => (e.StepHeight * Step(u - e.Offset, e.Sigma)) + (e.RimHeight * Rim(u - e.Offset, e.Sigma, e.RimWidth));

    private static double Step(double x, double sigma) => 0.5 * SpecialFunctions.Erfc(x / (sigma * Math.Sqrt(2)));

    private static double Rim(double x, double sigma, double w)
    {
        double z = (x + (sigma * sigma / w)) / (sigma * Math.Sqrt(2));
        double erfc = SpecialFunctions.Erfc(z);
        return erfc <= 0 ? 0 : 0.5 * Math.Exp((x / w) + (sigma * sigma / (2 * w * w)) + Math.Log(erfc));
    }

    private static (double Cost, double A, double B) Solve(double[] u, double[] y, double delta, double sigma, double w)
    {
        // A rim much narrower than the blur cannot be told from an outward shift of the step (to first order both add
        // a Gaussian bump at the edge), so the rim is kept at least half as wide as the blur (FROM MEMORY: edge-effect
        // bands span the electron range, tens of nm, so this holds for fields at a few nm to 20 nm per pixel).
        if (!(sigma is > 0.05 and < 20) || !(w >= 0.5 * sigma && w < 50))
        {
            return (double.PositiveInfinity, 0, 0);
        }
        double ss = 0, sr = 0, rr = 0, sy = 0, ry = 0;
        for (int i = 0; i < u.Length; i++)
        {
            double s = Step(u[i] - delta, sigma), r = Rim(u[i] - delta, sigma, w);
            ss += s * s;
            sr += s * r;
            rr += r * r;
            sy += s * y[i];
            ry += r * y[i];
        }
        double det = (ss * rr) - (sr * sr);
        double a, b;
        if (Math.Abs(det) < 1e-12 * ss * rr)
        {
            a = sy / ss;
            b = 0;
        }
        else
        {
            a = ((sy * rr) - (ry * sr)) / det;
            b = ((ry * ss) - (sy * sr)) / det;
        }
        if (b < 0)
        {
            // A dark rim is not the edge effect: fit the plain step.
            a = sy / ss;
            b = 0;
        }
        double cost = 0;
        for (int i = 0; i < u.Length; i++)
        {
            double d = (a * Step(u[i] - delta, sigma)) + (b * Rim(u[i] - delta, sigma, w)) - y[i];
            cost += d * d;
        }
        return (cost, a, b);
    }
}
