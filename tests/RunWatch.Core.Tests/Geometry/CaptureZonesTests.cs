using RunWatch.Core.Geometry;
using RunWatch.Core.PointPatterns;
using Xunit;

namespace RunWatch.Core.Tests.Geometry;

public sealed class CaptureZonesTests
{
    [Theory]
    [InlineData(double.PositiveInfinity, 1)]
    [InlineData(3.0, 2)]
    [InlineData(6.0, 3)]
    [InlineData(15.0, 4)]
    public void Compute_RandomPoints_MatchesNaiveAllPairsReference(double length, int seed)
    {
        // Outside reference: NaiveCaptureZone (O(N²) clipping by every bisector, disc as a 4096-gon), seeded points.
        var field = CaptureField.Rectangle(60, 40);
        Point2D[] points = NucleationSites.Uniform(field, 150, seed);
        CaptureZoneResult result = CaptureZones.Compute(points, field, new CaptureZoneOptions { DiffusionLength = length });
        for (int i = 0; i < points.Length; i++)
        {
            double expected = NaiveCaptureZone.Area(points, i, 0, 0, 60, 40, length);
            Assert.True(Math.Abs(result.Areas[i] - expected) <= 1e-6 * Math.Max(1.0, expected) + (1e-6 * expected),
                $"zone {i}: {result.Areas[i]} against naive {expected}");
        }
    }

    [Fact]
    public void Compute_InfiniteLength_CellsTileTheField()
    {
        // DERIVED: Voronoi cells clipped to the field partition it, so their areas sum to the field's area.
        var field = CaptureField.Rectangle(4096, 3072);
        Point2D[] points = NucleationSites.Poisson(field, 20_000 / field.Area, 11);
        CaptureZoneResult result = CaptureZones.Compute(points, field);
        double sum = 0;
        foreach (double a in result.Areas)
        {
            sum += a;
        }
        Assert.Equal(field.Area, sum, field.Area * 1e-10);
    }

    [Fact]
    public void Compute_PeriodicBox_CellsTileTheTorus()
    {
        // DERIVED: on a torus the cells tile the box exactly (CHECKS.md §3; COMPUTED HERE there: 1 + 1.6e-14).
        var field = CaptureField.PeriodicBox(1, 1);
        Point2D[] points = NucleationSites.Uniform(field, 5000, 5);
        CaptureZoneResult result = CaptureZones.Compute(points, field);
        double sum = 0;
        foreach (double a in result.Areas)
        {
            sum += a;
        }
        Assert.Equal(1.0, sum, 1e-10);
        Assert.Equal(points.Length, result.UnguardedCount);
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(3)]
    public void Compute_PeriodicSquareLattice_EveryCellIsOneLatticeSquare(int perSide)
    {
        // DERIVED: a square lattice of pitch a has square Voronoi cells of area a²; with 1–3 points per side the
        // cells are cut by the points' own periodic images.
        double pitch = 2.5;
        var field = CaptureField.PeriodicBox(perSide * pitch, perSide * pitch);
        var points = new List<Point2D>();
        for (int i = 0; i < perSide; i++)
        {
            for (int j = 0; j < perSide; j++)
            {
                points.Add(new Point2D((i + 0.3) * pitch, (j + 0.6) * pitch));
            }
        }
        CaptureZoneResult result = CaptureZones.Compute(points.ToArray(), field);
        foreach (double a in result.Areas)
        {
            Assert.Equal(pitch * pitch, a, 1e-9);
        }
    }

    [Fact]
    public void Compute_IsolatedPoint_ZoneIsWholeDisc()
    {
        // DERIVED: no neighbour within 2L and the disc inside the field: area πL², Â = 1.
        var field = CaptureField.Rectangle(100, 100);
        Point2D[] points = [new(50, 50), new(95, 95)];
        CaptureZoneResult result = CaptureZones.Compute(points, field, new CaptureZoneOptions { DiffusionLength = 10 });
        Assert.Equal(Math.PI * 100, result.Areas[0], 1e-9);
        Assert.Equal(1.0, result[0].NormalisedArea, 12);
        Assert.False(result[0].Guarded);
        Assert.True(result[1].Guarded);
    }

    [Fact]
    public void Compute_TwoPointsCloserThanTwoL_ShareTheLensByTheBisector()
    {
        // DERIVED: two discs of radius L at distance d; each zone is the disc minus the circular segment beyond
        // the bisector at h = d/2: πL² − (L²·acos(h/L) − h·√(L² − h²)).
        const double L = 5, d = 6, h = d / 2;
        var field = CaptureField.Rectangle(100, 100);
        Point2D[] points = [new(40, 50), new(40 + d, 50)];
        CaptureZoneResult result = CaptureZones.Compute(points, field, new CaptureZoneOptions { DiffusionLength = L });
        double expected = (Math.PI * L * L) - ((L * L * Math.Acos(h / L)) - (h * Math.Sqrt((L * L) - (h * h))));
        Assert.Equal(expected, result.Areas[0], 1e-9);
        Assert.Equal(expected, result.Areas[1], 1e-9);
    }

    [Fact]
    public void Compute_FiniteLength_GuardsDiscsCrossingEdgeOrBand()
    {
        // COMMON PRACTICE (guard-zone rule, DESIGN.md): a disc that leaves the field or reaches the band is guarded.
        var band = ExcludedBand.Horizontal(0, 200, 180, 200);
        var field = CaptureField.Rectangle(200, 200, band);
        Point2D[] points = [new(100, 100), new(5, 100), new(100, 175), new(100, 150)];
        CaptureZoneResult result = CaptureZones.Compute(points, field, new CaptureZoneOptions { DiffusionLength = 10 });
        Assert.False(result[0].Guarded);
        Assert.True(result[1].Guarded);
        Assert.True(result[2].Guarded);
        Assert.False(result[3].Guarded);
        Assert.Equal(2, result.UnguardedCount);
        Assert.Equal(2, result.UnguardedNormalisedAreas().Length);
    }

    [Fact]
    public void Compute_InfiniteLength_GuardsCellsReachingEdgeOrBand()
    {
        // DERIVED: a centred 3 × 3 lattice in a box: only the middle cell stays off the edge.
        var field = CaptureField.Rectangle(30, 30);
        var points = new List<Point2D>();
        for (int i = 0; i < 3; i++)
        {
            for (int j = 0; j < 3; j++)
            {
                points.Add(new Point2D(5 + (10 * i), 5 + (10 * j)));
            }
        }
        CaptureZoneResult result = CaptureZones.Compute(points.ToArray(), field);
        Assert.Equal(1, result.UnguardedCount);
        Assert.False(result[4].Guarded);
        Assert.Equal(100, result.Areas[4], 1e-9);

        // A band inside the field that overlaps the middle cell guards it.
        var banded = new CaptureField(0, 0, 30, 30, new ExcludedBand(14, 14, 16, 16));
        Assert.True(CaptureZones.Compute(points.ToArray(), banded)[4].Guarded);
    }

    [Fact]
    public void Compute_BandAtBottom_ClipsZonesAboveIt()
    {
        // DERIVED: one point, band over y ≥ 80 of a 100 × 100 field: its cell is the 100 × 80 part above the band.
        var field = CaptureField.Rectangle(100, 100, ExcludedBand.Horizontal(0, 100, 80, 100));
        CaptureZoneResult result = CaptureZones.Compute([new Point2D(30, 30)], field);
        Assert.Equal(8000, result.Areas[0], 1e-9);
        Assert.True(result[0].Guarded);
    }

    [Fact]
    public void Compute_ParallelAndSequential_GiveIdenticalResults()
    {
        var field = CaptureField.Rectangle(400, 300);
        Point2D[] points = NucleationSites.Uniform(field, 12_000, 21);
        var sequential = CaptureZones.Compute(points, field, new CaptureZoneOptions { DiffusionLength = 2.5, MaxDegreeOfParallelism = 1 });
        var parallel = CaptureZones.Compute(points, field, new CaptureZoneOptions { DiffusionLength = 2.5, MaxDegreeOfParallelism = 2 });
        Assert.True(sequential.Areas.SequenceEqual(parallel.Areas));
        Assert.True(sequential.Guarded.SequenceEqual(parallel.Guarded));
    }

    [Fact]
    public void Compute_OutlinesInParallel_EqualSequentialOutlines()
    {
        var field = CaptureField.Rectangle(400, 300);
        Point2D[] points = NucleationSites.Uniform(field, 9000, 22);
        var options = new CaptureZoneOptions { DiffusionLength = 2.0, IncludeOutlines = true, MaxDegreeOfParallelism = 1 };
        CaptureZoneResult sequential = CaptureZones.Compute(points, field, options);
        CaptureZoneResult parallel = CaptureZones.Compute(points, field, options with { MaxDegreeOfParallelism = 2 });
        for (int i = 0; i < points.Length; i++)
        {
            Assert.True(sequential.Outline(i).SequenceEqual(parallel.Outline(i)), $"outline {i} differs");
            Assert.True(sequential.Outline(i).Length >= 3);
        }
    }

    [Theory]
    [InlineData(double.PositiveInfinity)]
    [InlineData(4.0)]
    public void Compute_Outlines_EncloseTheZoneArea(double length)
    {
        // DERIVED: the outline's shoelace area equals the zone area (arcs sampled at 1°: the chord deficit per
        // arc is below 5e-5 of its sector, so 1e-3 relative bounds it).
        // 1500 points span three chunks of 512, so the re-ordering of outlines from grid order is exercised.
        var field = CaptureField.Rectangle(180, 150);
        Point2D[] points = NucleationSites.Uniform(field, 1500, 8);
        var options = new CaptureZoneOptions { DiffusionLength = length, IncludeOutlines = true, OutlineArcStepDegrees = 1 };
        CaptureZoneResult result = CaptureZones.Compute(points, field, options);
        for (int i = 0; i < points.Length; i++)
        {
            ReadOnlySpan<Point2D> outline = result.Outline(i);
            double twice = 0;
            for (int k = 0; k < outline.Length; k++)
            {
                Point2D a = outline[k], b = outline[(k + 1) % outline.Length];
                twice += (a.X * b.Y) - (b.X * a.Y);
            }
            Assert.Equal(result.Areas[i], Math.Abs(twice) / 2, 1e-3 * result.Areas[i]);
        }
    }

    [Fact]
    public void Compute_PointsCrowdedInACornerOfAHugeField_GiveTheSameZonesAsInASmallField()
    {
        // DERIVED: with L = 1 and every disc inside both fields, the zones cannot depend on the field's size.
        var small = new CaptureField(0, 0, 30, 30);
        var huge = new CaptureField(0, 0, 1e6, 1e6);
        Point2D[] points = NucleationSites.Uniform(new CaptureField(5, 5, 25, 25), 5000, 31);
        var options = new CaptureZoneOptions { DiffusionLength = 1.0 };
        CaptureZoneResult inSmall = CaptureZones.Compute(points, small, options);
        CaptureZoneResult inHuge = CaptureZones.Compute(points, huge, options);
        for (int i = 0; i < points.Length; i++)
        {
            Assert.Equal(inSmall.Areas[i], inHuge.Areas[i], 1e-9);
        }
    }

    [Fact]
    public void Compute_CollinearPoints_CellsAreStrips()
    {
        // DERIVED: points on the line y = 5 at x = 1, 3, 5, 7, 9 in a 10 × 10 field: cells are 2 × 10 strips.
        Point2D[] points = [new(1, 5), new(3, 5), new(5, 5), new(7, 5), new(9, 5)];
        CaptureZoneResult result = CaptureZones.Compute(points, CaptureField.Rectangle(10, 10));
        foreach (double a in result.Areas)
        {
            Assert.Equal(20.0, a, 9);
        }
    }

    [Fact]
    public void Compute_DuplicatePoints_ThrowsNamingThem()
    {
        var field = CaptureField.Rectangle(10, 10);
        var ex = Assert.Throws<ArgumentException>(() => CaptureZones.Compute([new(1, 1), new(5, 5), new(1, 1)], field));
        Assert.Contains("coincide", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Compute_PointOutsideField_ThrowsNamingIt()
    {
        var field = CaptureField.Rectangle(10, 10);
        var ex = Assert.Throws<ArgumentException>(() => CaptureZones.Compute([new(1, 1), new(11, 5)], field));
        Assert.Contains("point 1", ex.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(-1.0)]
    [InlineData(double.NaN)]
    public void Validate_BadDiffusionLength_Throws(double length)
    {
        Assert.Throws<ArgumentException>(() => new CaptureZoneOptions { DiffusionLength = length }.Validate());
    }

    [Fact]
    public void Compute_NoPoints_ReturnsEmptyResult()
    {
        CaptureZoneResult result = CaptureZones.Compute([], CaptureField.Rectangle(10, 10));
        Assert.Equal(0, result.Count);
        Assert.Equal(0, result.UnguardedCount);
    }
}
