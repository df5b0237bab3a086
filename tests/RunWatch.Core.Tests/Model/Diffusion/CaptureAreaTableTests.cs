using RunWatch.Core.Geometry;
using RunWatch.Core.Model.Diffusion;
using Xunit;
using Xunit.Abstractions;

namespace RunWatch.Core.Tests.Model.Diffusion;

public sealed class CaptureAreaTableTests(ITestOutputHelper output)
{
    /// <summary>Between nodes the table (cubic in ln λ, resampled) matches a direct solve at that λ within 0.3 %.</summary>
    [Theory]
    [InlineData(0.37)]
    [InlineData(0.83)]
    [InlineData(1.41)]
    public void AreaAt_BetweenNodes_MatchesDirectSolve(double lambda)
    {
        var field = CaptureField.Rectangle(5, 4);
        (Point2D[] centres, double[] radii) = DiffusionTestFields.Poisson(field, 1.5, 21);
        CaptureAreaTable table = CaptureAreaTable.Build(centres, radii, field, 0.2, 2.0);
        SinkGrid grid = SinkGrid.Rasterise(centres, radii, field, table.CellSizeUm);

        SinkCurrents direct = new ScreenedDiffusionSolver(grid).Solve(lambda, BorderCondition.Reflecting);

        double worst = 0;
        for (int i = 0; i < centres.Length; i++)
        {
            worst = Math.Max(worst, Math.Abs(table.AreaAt(i, lambda) / direct.CaptureAreas[i] - 1));
        }
        output.WriteLine($"λ = {lambda}: worst relative difference {worst:E2} over {centres.Length} wires");
        Assert.True(worst < 0.003, $"worst {worst}");
    }

    /// <summary>
    /// Guard rule against the whole substrate: a 7 × 6 µm image cut from the middle of a 15 × 14 µm substrate. For
    /// every wire, the substrate's value (edge ≥ 4 µm away, so its own border does not matter) lies between the
    /// image's absorbing and saturated results, and every wire left unguarded is within the guard tolerance of it.
    /// </summary>
    [Fact]
    public void Build_ImageCutFromSubstrate_BoundsHoldTheTruthAndUnguardedWiresMatchIt()
    {
        var substrate = CaptureField.Rectangle(15, 14);
        (Point2D[] all, double[] allRadii) = DiffusionTestFields.Poisson(substrate, 1.5, 8);
        var image = new CaptureField(4, 4, 11, 10);
        var inside = new List<int>();
        for (int i = 0; i < all.Length; i++)
        {
            if (all[i].X >= 4 && all[i].X <= 11 && all[i].Y >= 4 && all[i].Y <= 10)
            {
                inside.Add(i);
            }
        }
        Point2D[] centres = inside.Select(i => all[i]).ToArray();
        double[] radii = inside.Select(i => allRadii[i]).ToArray();
        const double lambda = 0.45;
        CaptureAreaTable table = CaptureAreaTable.Build(centres, radii, image, 0.2, lambda);
        SinkGrid whole = SinkGrid.Rasterise(all, allRadii, substrate, table.CellSizeUm);
        int top = table.NodeLambdasUm.Length - 1;
        SinkCurrents truth = new ScreenedDiffusionSolver(whole).Solve(table.NodeLambdasUm[top], BorderCondition.Reflecting);
        var guarded = new bool[centres.Length];
        int guardedCount = table.GuardFor(table.NodeLambdasUm[top], guarded);

        int unguarded = 0;
        for (int j = 0; j < centres.Length; j++)
        {
            double t = truth.CaptureAreas[inside[j]];
            double lo = table.LowerBoundsUm2[(top * centres.Length) + j], hi = table.UpperBoundsUm2[(top * centres.Length) + j];
            Assert.True(t >= lo * (1 - 1e-6) && t <= hi * (1 + 1e-6), $"wire {j}: truth {t} outside [{lo}, {hi}]");
            if (!guarded[j])
            {
                unguarded++;
                double estimate = table.NodeAreasUm2[(top * centres.Length) + j];
                Assert.True(Math.Abs(estimate - t) <= table.GuardTolerance * t, $"wire {j}: estimate {estimate}, truth {t}");
            }
        }
        output.WriteLine($"λ = {table.NodeLambdasUm[top]:F3}: {unguarded} unguarded of {centres.Length}");
        Assert.True(unguarded >= 5, $"only {unguarded} unguarded");
        Assert.Equal(centres.Length - unguarded, guardedCount);
    }

    /// <summary>The bound width grows with λ, so fewer wires are guarded for a history that stays at smaller λ.</summary>
    [Fact]
    public void GuardFor_SmallerLambda_GuardsNoMoreWires()
    {
        var field = CaptureField.Rectangle(5, 4);
        (Point2D[] centres, double[] radii) = DiffusionTestFields.Poisson(field, 1.5, 3);
        CaptureAreaTable table = CaptureAreaTable.Build(centres, radii, field, 0.2, 3.0);
        var guarded = new bool[centres.Length];

        int previous = -1;
        foreach (double lambda in table.NodeLambdasUm)
        {
            int count = table.GuardFor(lambda, guarded);
            Assert.True(count >= previous, $"λ = {lambda}: {count} guarded after {previous}");
            previous = count;
        }
        Assert.True(table.GuardFor(table.LambdaMinUm, guarded) < centres.Length);
    }

    /// <summary>The simpler option: at a node the table holds the geometry room's Voronoi ∩ disc areas and guards (checked there against scipy + shapely).</summary>
    [Fact]
    public void Build_VoronoiDiscMethod_HoldsGeometryZonesAtNodes()
    {
        var field = CaptureField.Rectangle(6, 5);
        (Point2D[] centres, double[] radii) = DiffusionTestFields.Poisson(field, 1.5, 4);
        CaptureAreaTable table = CaptureAreaTable.Build(centres, radii, field, 0.3, 1.0, new CaptureTableOptions { Method = CaptureAreaMethod.VoronoiDisc });
        double lambda = table.NodeLambdasUm[1];

        CaptureZoneResult zones = CaptureZones.Compute(centres, field, new CaptureZoneOptions { DiffusionLength = lambda, GuardRule = GuardRule.UnseenNeighbourCouldCut });

        var guarded = new bool[centres.Length];
        table.GuardFor(lambda, guarded);
        for (int i = 0; i < centres.Length; i++)
        {
            // The resampled table is linear between points 0.01 apart in ln λ: 1e-4 relative.
            Assert.Equal(zones.Areas[i], table.AreaAt(i, lambda), 1e-4 * zones.Areas[i]);
            Assert.Equal(zones.Guarded[i], guarded[i]);
        }
    }

    [Fact]
    public void Validate_BadOptions_ListsEveryProblem()
    {
        var options = new CaptureTableOptions { CellSizeUm = 0, NodeRatio = 1, GuardTolerance = 2, MaxDegreeOfParallelism = -1 };

        Assert.Equal(4, options.Validate().Count);
        Assert.Empty(new CaptureTableOptions().Validate());
    }
}
