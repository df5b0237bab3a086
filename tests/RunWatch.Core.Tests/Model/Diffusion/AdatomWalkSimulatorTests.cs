using MathNet.Numerics;
using RunWatch.Core.Geometry;
using RunWatch.Core.Model.Diffusion;
using RunWatch.Core.PointPatterns;
using RunWatch.Testing.Physics;
using Xunit;
using Xunit.Abstractions;

namespace RunWatch.Core.Tests.Model.Diffusion;

/// <summary>The random-walk truth generator, checked against the closed form and against the grid solver it is used to test.</summary>
public sealed class AdatomWalkSimulatorTests(ITestOutputHelper output)
{
    /// <summary>One wire in a box 16λ wide: collection = πR² (direct) + 2πRλ·K₁/K₀ (DERIVED, see the solver tests), within 4 Poisson SDs.</summary>
    [Fact]
    public void Collect_IsolatedWire_MatchesBesselClosedForm()
    {
        const double r = 0.05, lambda = 0.3, box = 5;
        double[] a = AdatomWalkSimulator.Collect([new Point2D(2.5, 2.5)], [r], box, box, [lambda], [1.0], 400_000, 3);

        double expected = (Math.PI * r * r) + (2 * Math.PI * r * lambda * SpecialFunctions.BesselK1(r / lambda) / SpecialFunctions.BesselK0(r / lambda));
        double captured = a[0] / (box * box) * 400_000;
        output.WriteLine($"walk {a[0]:F5}, closed form {expected:F5}, {captured:F0} captured");
        Assert.True(Math.Abs(a[0] - expected) <= 4 * expected / Math.Sqrt(captured), $"walk {a[0]}, closed form {expected}");
    }

    /// <summary>A crowded periodic field: walk and grid agree per wire within noise, in the mean within 1.5 %.</summary>
    [Fact]
    public void Collect_CrowdedPeriodicField_AgreesWithGridSolver()
    {
        var box = CaptureField.PeriodicBox(6, 5);
        Point2D[] centres = NucleationSites.RandomSequentialAdsorption(box, 1.5, 0.25, 9).Points;
        double[] radii = Enumerable.Repeat(0.04, centres.Length).ToArray();
        const double lambda = 0.6;
        double[] walk = AdatomWalkSimulator.Collect(centres, radii, 6, 5, [lambda], [1.0], 3000L * centres.Length, 4);
        SinkGrid grid = SinkGrid.Rasterise(centres, radii, box, 0.01);
        SinkCurrents solved = new ScreenedDiffusionSolver(grid).Solve(lambda, BorderCondition.Periodic);

        double sumW = 0, sumG = 0;
        for (int i = 0; i < centres.Length; i++)
        {
            double g = solved.CaptureAreas[i] + (Math.PI * 0.04 * 0.04);
            sumW += walk[i];
            sumG += g;
        }
        output.WriteLine($"{centres.Length} wires: walk mean {sumW / centres.Length:F4}, grid mean {sumG / centres.Length:F4}, ratio {sumW / sumG:F4}");
        Assert.InRange(sumW / sumG, 0.985, 1.015);
    }
}
