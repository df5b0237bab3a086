using RunWatch.Core.Geometry;
using RunWatch.Core.PointPatterns;
using RunWatch.Simulation.Growth;
using Xunit;
using Xunit.Abstractions;

namespace RunWatch.Simulation.Tests.Growth;

public sealed class GrowthSimulationTests(ITestOutputHelper output)
{
    private static CaptureHistory Held(AdatomPhysics physics, double temperatureC, double seconds)
    {
        int count = (int)seconds;
        var t = new double[count];
        var c = new double[count];
        for (int k = 0; k < count; k++)
        {
            t[k] = k;
            c[k] = temperatureC;
        }
        return new CaptureHistory(t, c, physics);
    }

    /// <summary>
    /// Mass balance of the growth law: Σ π(r² − r₀²)·h = G × Σ collected area-time (DERIVED, volume conservation at
    /// fixed height), and what the wires collect plus what desorbed is every adatom launched; the numbers lie in the
    /// ranges docs/model.md states for the demo (radii 20–80 nm).
    /// </summary>
    [Fact]
    public void Grow_DemoDensity_VolumeMatchesCollectionAndRadiiPlausible()
    {
        var physics = new AdatomPhysics();
        CaptureHistory history = Held(physics, 610, 1800);
        var box = CaptureField.PeriodicBox(6, 5);
        Point2D[] sites = NucleationSites.RandomSequentialAdsorption(box, 2.0, 0.3, 5).Points;

        GrownWires wires = GrowthSimulation.Grow(sites, 6, 5, history, physics, 1500, 7);

        double volume = 0, collected = 0;
        for (int i = 0; i < sites.Length; i++)
        {
            volume += Math.PI * ((wires.RadiiNm[i] * wires.RadiiNm[i]) - (wires.SeedRadiiNm[i] * wires.SeedRadiiNm[i])) * physics.WireHeightNm;
            collected += wires.AreaTimeUm2S[i];
        }
        double expectedVolume = physics.GrowthRateNmPerS * collected * 1e6;
        output.WriteLine($"{sites.Length} wires, λ {physics.CaptureLengthUm(610):F3} µm: radii {wires.RadiiNm.Min():F1}–{wires.RadiiNm.Max():F1} nm (mean {wires.RadiiNm.Average():F1}); caught {wires.Caught} + desorbed {wires.Desorbed} of {wires.Launched}");
        Assert.Equal(expectedVolume, volume, expectedVolume * 1e-9);
        Assert.Equal(wires.Launched, wires.Caught + wires.Desorbed);
        Assert.True(collected < 30 * 1800, "no more than the whole substrate's area-time");
        Assert.InRange(wires.RadiiNm.Average(), 25, 70);
        Assert.All(wires.RadiiNm, r => Assert.InRange(r, 15, 90));
    }

    /// <summary>Hotter growth shortens λ here (E_des &gt; E_D), so at equal time and sites the wires come out thinner; same seed, same wires.</summary>
    [Fact]
    public void Grow_HotterSameSites_ThinnerAndSeeded()
    {
        var physics = new AdatomPhysics();
        var box = CaptureField.PeriodicBox(5, 5);
        Point2D[] sites = NucleationSites.RandomSequentialAdsorption(box, 2.0, 0.3, 6).Points;

        GrownWires cool = GrowthSimulation.Grow(sites, 5, 5, Held(physics, 590, 1200), physics, 800, 8);
        GrownWires hot = GrowthSimulation.Grow(sites, 5, 5, Held(physics, 630, 1200), physics, 800, 8);
        GrownWires again = GrowthSimulation.Grow(sites, 5, 5, Held(physics, 590, 1200), physics, 800, 8);

        output.WriteLine($"590 °C mean {cool.RadiiNm.Average():F2} nm, 630 °C mean {hot.RadiiNm.Average():F2} nm");
        Assert.True(physics.CaptureLengthUm(630) < physics.CaptureLengthUm(590));
        Assert.True(hot.RadiiNm.Average() < cool.RadiiNm.Average() - 1);
        Assert.Equal(cool.RadiiNm, again.RadiiNm);
    }
}
