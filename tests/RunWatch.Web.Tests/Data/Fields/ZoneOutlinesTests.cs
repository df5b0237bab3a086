using System.Globalization;
using RunWatch.Web.Data.Fields;
using Xunit;

namespace RunWatch.Web.Tests.Data.Fields;

/// <summary>The viewer's zone outlines against closed forms of plane geometry (DERIVED, no library).</summary>
public sealed class ZoneOutlinesTests
{
    [Fact]
    public void Compute_LoneWireFarFromEdges_OutlineIsItsDiscOfRadiusL()
    {
        // One wire at the middle of a 4000 × 3000 nm field, L = 300 nm: its zone is the whole disc. Sampled at 15°,
        // the outline is the inscribed 24-gon of area (n/2)·L²·sin(2π/n) (DERIVED) and every vertex lies at L.
        var field = new FieldDetail("1", "f", "W", FieldQueueState.Done, null, 4, 1000, 750, 3000, 300, [new FieldWireView(1, 2000, 1500, 40, true, true, 1, 40)], []);

        var outline = Points(ZoneOutlines.Compute(field)[1]);

        const int N = 24;
        double expected = N / 2.0 * 300 * 300 * Math.Sin(2 * Math.PI / N);
        Assert.InRange(Area(outline) * 16, expected * 0.99, expected * 1.01); // px² → nm² at 4 nm/px
        Assert.All(outline, p => Assert.Equal(300, Math.Sqrt(Math.Pow((p.X * 4) - 2000, 2) + Math.Pow((p.Y * 4) - 1500, 2)), 0.5));
    }

    [Fact]
    public void Compute_TwoWiresCloserThan2L_CellsMeetOnThePerpendicularBisector()
    {
        // Wires at x = 1800 and 2200 nm: each zone is its disc cut by the line x = 2000 (the bisector). The left zone's
        // area is the disc less the circular segment beyond distance d = 200 from its centre: L²·acos(d/L) − d·√(L²−d²).
        var field = new FieldDetail("1", "f", "W", FieldQueueState.Done, null, 1, 4000, 3000, 3000, 300,
            [new FieldWireView(1, 1800, 1500, 40, true, true, 1, 40), new FieldWireView(2, 2200, 1500, 40, true, true, 1, 40)], []);

        var zones = ZoneOutlines.Compute(field);
        var left = Points(zones[1]);

        Assert.All(left, p => Assert.True(p.X <= 2000.05, $"vertex {p.X} beyond the bisector"));
        Assert.Contains(left, p => Math.Abs(p.X - 2000) < 0.05);
        double segment = (300 * 300 * Math.Acos(200.0 / 300)) - (200 * Math.Sqrt((300 * 300) - (200 * 200)));
        double disc = Math.PI * 300 * 300;
        Assert.InRange(Area(left), (disc - segment) * 0.98, (disc - segment) * 1.005); // arcs sampled at 15° lose a little
    }

    [Fact]
    public void Compute_NoDiffusionLength_NoOutlines()
    {
        var field = new FieldDetail("1", "f", "W", FieldQueueState.Done, null, 4, 1000, 750, 3000, null, [new FieldWireView(1, 2000, 1500, 40, true, true, null, null)], []);
        Assert.Empty(ZoneOutlines.Compute(field));
    }

    private static List<(double X, double Y)> Points(string svg) =>
        [.. svg.Split(' ').Select(p => p.Split(',')).Select(c => (double.Parse(c[0], CultureInfo.InvariantCulture), double.Parse(c[1], CultureInfo.InvariantCulture)))];

    private static double Area(List<(double X, double Y)> p)
    {
        double sum = 0;
        for (int i = 0; i < p.Count; i++)
        {
            var (x0, y0) = p[i];
            var (x1, y1) = p[(i + 1) % p.Count];
            sum += (x0 * y1) - (x1 * y0);
        }
        return Math.Abs(sum) / 2;
    }
}
