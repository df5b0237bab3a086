using System.Globalization;
using System.Text.Json;
using MathNet.Numerics;
using RunWatch.Core.Geometry;
using RunWatch.Core.Model.Diffusion;
using RunWatch.Testing.Reference;
using Xunit;
using Xunit.Abstractions;

namespace RunWatch.Core.Tests.Model.Diffusion;

public sealed class ScreenedDiffusionSolverTests(ITestOutputHelper output)
{
    /// <summary>
    /// Isolated disc sink of radius R in an unbounded substrate: the current ÷ F is 2πRλ·K₁(R/λ)/K₀(R/λ) (DERIVED: the
    /// radial solution of ∇²u − u/λ² + 1 = 0 with u(R) = 0, u → λ², is u = λ²·(1 − K₀(r/λ)/K₀(R/λ)); the flux at R
    /// times 2πR). Bessel functions from MathNet.Numerics (outside library). The field edge is 8λ from the disc, so
    /// the border changes the current by about e⁻⁸.
    /// </summary>
    [Theory]
    [InlineData(10.0, 20.0)]
    [InlineData(10.0, 5.0)]
    [InlineData(8.0, 40.0)]
    [InlineData(16.0, 10.0)]
    [InlineData(4.0, 20.0)]
    public void Solve_IsolatedDisc_MatchesBesselClosedFormWithin1Percent(double radius, double lambda)
    {
        double half = radius + (8 * lambda);
        var field = CaptureField.Rectangle(2 * half, 2 * half);
        SinkGrid grid = SinkGrid.Rasterise([new Point2D(half + 0.3, half - 0.2)], [radius], field, 1.0);
        var solver = new ScreenedDiffusionSolver(grid);

        SinkCurrents result = solver.Solve(lambda, BorderCondition.Reflecting);

        double x = radius / lambda;
        double expected = 2 * Math.PI * radius * lambda * SpecialFunctions.BesselK1(x) / SpecialFunctions.BesselK0(x);
        output.WriteLine($"R={radius} λ={lambda}: grid {result.CaptureAreas[0]:F3}, closed form {expected:F3}, ratio {result.CaptureAreas[0] / expected:F5}, {result.Iterations} iterations");
        Assert.InRange(result.CaptureAreas[0] / expected, 0.99, 1.01);
    }

    /// <summary>Mass balance: captured + desorbed + border outflow = F × free area (DERIVED: summing the discrete equation over the free cells telescopes the interior fluxes).</summary>
    [Theory]
    [InlineData(BorderCondition.Absorbing, 0.3)]
    [InlineData(BorderCondition.Saturated, 0.3)]
    [InlineData(BorderCondition.Reflecting, 0.3)]
    [InlineData(BorderCondition.Reflecting, 2.0)]
    [InlineData(BorderCondition.Absorbing, double.PositiveInfinity)]
    public void Solve_PoissonField_ConservesMassTo1e6(BorderCondition border, double lambda)
    {
        var field = CaptureField.Rectangle(6, 4.5);
        (Point2D[] centres, double[] radii) = DiffusionTestFields.Poisson(field, 3.0, 11);
        SinkGrid grid = SinkGrid.Rasterise(centres, radii, field, 0.02);
        var solver = new ScreenedDiffusionSolver(grid);

        SinkCurrents result = solver.Solve(lambda, border);

        Assert.True(Math.Abs(result.BalanceError) <= 1e-6 * result.FreeArea, $"balance error {result.BalanceError} of {result.FreeArea}");
        Assert.All(result.CaptureAreas, a => Assert.True(a > 0));
        if (border == BorderCondition.Saturated)
        {
            Assert.True(result.BorderOutflowArea < 0, "a saturated border feeds the field");
        }
    }

    /// <summary>
    /// Hexagonal lattice of equal wires on a torus (lattice constant 30.25 cells, rows 26 cells apart so the box of
    /// 242 × 208 cells closes: 0.75 % flatter than ideal). The sites sit at four different offsets within their cells,
    /// so the rasterised footprints differ: every wire still collects the same within 0.5 %, and at λ = ∞ (no
    /// desorption) each collects its whole lattice cell, 30.25 × 26 = 786.5 cells², less its own footprint
    /// (DERIVED: translation symmetry of the continuum problem plus mass balance).
    /// </summary>
    [Theory]
    [InlineData(15.0)]
    [InlineData(60.0)]
    [InlineData(double.PositiveInfinity)]
    public void Solve_HexagonalLatticeOnTorus_AllWiresEqualAndInfiniteLambdaGivesLatticeCell(double lambda)
    {
        const double a = 30.25, rowStep = 26;
        var field = CaptureField.PeriodicBox(8 * a, 8 * rowStep);
        var centres = new List<Point2D>();
        for (int j = 0; j < 8; j++)
        {
            for (int i = 0; i < 8; i++)
            {
                centres.Add(new Point2D(((i + (0.5 * (j % 2))) * a) + 3.37, (j * rowStep) + 5.21));
            }
        }
        double[] radii = Enumerable.Repeat(4.3, centres.Count).ToArray();
        SinkGrid grid = SinkGrid.Rasterise(centres.ToArray(), radii, field, 1.0);
        var solver = new ScreenedDiffusionSolver(grid);

        SinkCurrents result = solver.Solve(lambda, BorderCondition.Periodic);

        double mean = result.CaptureAreas.Average();
        double spread = result.CaptureAreas.Max() - result.CaptureAreas.Min();
        output.WriteLine($"λ={lambda}: mean {mean:F3}, spread {spread:F4}, {result.Iterations} iterations");
        Assert.True(spread <= 0.005 * mean, $"spread {spread} of mean {mean}");
        if (double.IsPositiveInfinity(lambda))
        {
            for (int i = 0; i < centres.Count; i++)
            {
                double cell = result.CaptureAreas[i] + grid.FootprintCells[i];
                Assert.True(Math.Abs(cell - (a * rowStep)) <= 0.005 * a * rowStep, $"wire {i}: {cell}");
            }
        }
        else
        {
            Assert.True(mean < (a * rowStep) - (Math.PI * 4.3 * 4.3), "desorption takes a share");
        }
    }

    /// <summary>
    /// The same grid system assembled independently and solved directly by scipy.sparse.linalg.spsolve (SuperLU)
    /// in tests/reference/diffusion_grid_reference.py (Debian python3-scipy): every wire within 1e-4 relative.
    /// </summary>
    [Theory]
    [InlineData(BorderCondition.Absorbing, 0.3)]
    [InlineData(BorderCondition.Saturated, 0.5)]
    [InlineData(BorderCondition.Reflecting, 1.5)]
    public void Solve_PoissonField_MatchesScipyDirectSolveTo1e4(BorderCondition border, double lambda)
    {
        var field = CaptureField.Rectangle(4, 3, ExcludedBand.Horizontal(0, 4, 2.7, 3));
        (Point2D[] centres, double[] radii) = DiffusionTestFields.Poisson(CaptureField.Rectangle(4, 2.7), 3.0, 5);
        SinkGrid grid = SinkGrid.Rasterise(centres, radii, field, 0.02);
        var solver = new ScreenedDiffusionSolver(grid, new DiffusionSolverOptions { RelativeTolerance = 1e-12 });

        SinkCurrents ours = solver.Solve(lambda, border);
        using JsonDocument reference = DiffusionReference.Run(grid, lambda, border, "direct");

        double[] theirs = reference.RootElement.GetProperty("capture").EnumerateArray().Select(e => e.GetDouble()).ToArray();
        Assert.Equal(ours.CaptureAreas.Length, theirs.Length);
        for (int i = 0; i < theirs.Length; i++)
        {
            Assert.True(Math.Abs(ours.CaptureAreas[i] - theirs[i]) <= 1e-4 * theirs[i], $"wire {i}: ours {ours.CaptureAreas[i]}, scipy {theirs[i]}");
        }
        Assert.Equal(reference.RootElement.GetProperty("desorbed").GetDouble(), ours.DesorbedArea, 1e-4 * ours.FreeArea);
        output.WriteLine(string.Create(CultureInfo.InvariantCulture, $"{theirs.Length} wires, {ours.Iterations} iterations"));
    }

    [Fact]
    public void Solve_SaturatedBorderWithInfiniteLambda_Throws()
    {
        var field = CaptureField.Rectangle(10, 10);
        SinkGrid grid = SinkGrid.Rasterise([new Point2D(5, 5)], [1.0], field, 1.0);
        var solver = new ScreenedDiffusionSolver(grid);

        Assert.Throws<ArgumentException>(() => solver.Solve(double.PositiveInfinity, BorderCondition.Saturated));
        Assert.Throws<ArgumentException>(() => solver.Solve(-1, BorderCondition.Reflecting));
        Assert.Throws<ArgumentException>(() => solver.Solve(1, BorderCondition.Periodic));
    }

    [Fact]
    public void Validate_BadOptions_ListsEveryProblem()
    {
        var options = new DiffusionSolverOptions { RelativeTolerance = 0, MaxIterations = 0, Relaxation = 2 };

        Assert.Equal(3, options.Validate().Count);
        Assert.Empty(new DiffusionSolverOptions().Validate());
    }
}
