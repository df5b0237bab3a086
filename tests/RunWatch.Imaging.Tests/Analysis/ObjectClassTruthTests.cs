using RunWatch.Imaging.Analysis;
using RunWatch.Imaging.Measurement;
using RunWatch.Imaging.Tests.Support;
using RunWatch.Simulation.Sem;
using Xunit;
using Xunit.Abstractions;

namespace RunWatch.Imaging.Tests.Analysis;

/// <summary>
/// Crystallites, touching wires and droplets against the generator's truth (what was drawn where), on fields with
/// every effect on. Recall figures are printed per case.
/// </summary>
public sealed class ObjectClassTruthTests(ITestOutputHelper output)
{
    private static TruthMatch Field(int seed, double drift = 0.1, double dose = 40, double minRadius = 5, double maxRadius = 10, MicroscopeSceneOptions? scene = null, FieldAnalysisOptions? options = null)
    {
        var spec = new MicroscopeFieldSpec { Width = 1024, Height = 768, Seed = seed, DoseElectronsPerPixel = dose, DriftFraction = drift };
        scene ??= new MicroscopeSceneOptions { Seed = seed, MinRadiusPx = minRadius, MaxRadiusPx = maxRadius, Units = 260 };
        return new TruthMatch(MicroscopeFieldGenerator.Generate(MicroscopeFields.With(spec, MicroscopeScene.Build(spec, scene))), options);
    }

    [Theory]
    [InlineData(41, 0.1, 40)]
    [InlineData(42, 0.2, 40)]
    [InlineData(43, 0.1, 15)]
    public void Classify_Crystallites_FewTakenForVerticalWiresAndFewWiresLost(int seed, double drift, double dose)
    {
        var crystals = new List<WireMeasurement?>();
        int wires = 0, wiresKept = 0, wiresMissed = 0;
        foreach (int s in new[] { seed, seed + 100 })
        {
            TruthMatch m = Field(s, drift, dose, scene: new MicroscopeSceneOptions { Seed = s, MinRadiusPx = 5, MaxRadiusPx = 10, Units = 260, CrystalliteFraction = 0.25 });
            crystals.AddRange(m.Pairs.Where(p => p.Truth.Kind == SemObjectKind.Parasitic && m.Interior(p.Truth)).Select(p => p.Found));
            foreach (var (_, f) in m.PlainIsolated())
            {
                wires++;
                wiresKept += f?.Class == WireClass.Vertical ? 1 : 0;
                wiresMissed += f is null ? 1 : 0;
            }
        }
        int found = crystals.Count(c => c is not null);
        int asVertical = crystals.Count(c => c?.Class == WireClass.Vertical);
        output.WriteLine($"drift {drift:P0}, dose {dose}: crystallites drawn {crystals.Count}, found {found}, classed vertical {asVertical} ({(double)asVertical / Math.Max(1, found):P1} of found); " +
            $"plain vertical wires {wires}, kept vertical {wiresKept} (lost {1 - ((double)wiresKept / wires):P1}, of which not found by the threshold {wiresMissed})");
        Assert.True(found >= 40, $"only {found} crystallites found: the fixture cannot test the separation");
        Assert.InRange((double)asVertical / found, 0, 0.10);
        Assert.InRange(1 - ((double)wiresKept / wires), 0, 0.02);
    }

    [Theory]
    [InlineData(51)]
    [InlineData(52)]
    public void Split_TouchingWires_EachFoundAsItsOwnWire(int seed)
    {
        var byArrangement = new Dictionary<TouchArrangement, (int Members, int Own, int Elongated)>();
        foreach (int s in new[] { seed, seed + 100 })
        {
            TruthMatch m = Field(s, scene: new MicroscopeSceneOptions
            {
                Seed = s, MinRadiusPx = 5, MaxRadiusPx = 10, Units = 220, FaceToFaceFraction = 0.12, CornerToCornerFraction = 0.12, ChainFraction = 0.08,
                CrystalliteFraction = 0.05, TiltedFraction = 0.02,
            });
            foreach (var group in m.Pairs.Where(p => p.Truth.Group > 0).GroupBy(p => p.Truth.Group))
            {
                if (!group.All(p => m.Interior(p.Truth)))
                {
                    continue;
                }
                foreach (var (t, f) in group)
                {
                    // Its own wire: found, and no other member of the group maps to the same object.
                    bool own = f is not null && group.Count(p => p.Found?.Id == f.Id) == 1;
                    var (members, owns, elongated) = byArrangement.GetValueOrDefault(t.Touch);
                    byArrangement[t.Touch] = (members + 1, owns + (own ? 1 : 0), elongated + (own && f!.Class == WireClass.Elongated ? 1 : 0));
                }
            }
        }
        int total = 0, split = 0, elongatedTotal = 0;
        foreach (var (arrangement, (members, own, elongated)) in byArrangement)
        {
            output.WriteLine($"{arrangement}: {own}/{members} found as their own wire ({(double)own / members:P1}), {elongated} of those classed elongated");
            total += members;
            split += own;
            elongatedTotal += elongated;
        }
        output.WriteLine($"all touching: {split}/{total} = {(double)split / total:P1}; split pieces classed elongated {elongatedTotal}");
        Assert.True(total >= 60);
        Assert.InRange((double)split / total, 0.90, 1);
        Assert.InRange((double)elongatedTotal / split, 0, 0.05);
    }

    [Fact]
    public void Droplets_VisibleAndHiding_ReportDropletAndWireRadiusSeparately()
    {
        const double ContactAngle = 130;
        var scene = new MicroscopeSceneOptions { Seed = 61, MinRadiusPx = 5, MaxRadiusPx = 10, Units = 260, VisibleFacetDropletFraction = 0.25, DropletOnlyFraction = 0.2, ContactAngleDeg = ContactAngle };
        TruthMatch m = Field(61, scene: scene, options: new FieldAnalysisOptions { DropletContactAngleDeg = ContactAngle });
        var hiding = m.Pairs.Where(p => p.Truth.Kind == SemObjectKind.Vertical && p.Truth.Group == 0 && p.Truth.OnlyDropletVisible && m.Interior(p.Truth)).ToList();
        var visible = m.Pairs.Where(p => p.Truth.Kind == SemObjectKind.Vertical && p.Truth.Group == 0 && p.Truth.DropletRadius > 0 && !p.Truth.OnlyDropletVisible && m.Interior(p.Truth)).ToList();
        var hidingFound = hiding.Where(p => p.Found?.RadiusMethod == "droplet").ToList();
        double[] dropletErr = hidingFound.Select(p => (p.Found!.DropletRadius!.Value / p.Truth.DropletRadius) - 1).OrderBy(x => x).ToArray();
        double[] wireErr = hidingFound.Select(p => (p.Found!.EquivalentRadius / p.Truth.EquivalentRadius) - 1).OrderBy(x => x).ToArray();
        var visibleEdge = visible.Where(p => p.Found?.Class == WireClass.Vertical && p.Found.RadiusMethod == "edge").ToList();
        double[] facetErr = visibleEdge.Select(p => (p.Found!.EquivalentRadius / p.Truth.EquivalentRadius) - 1).OrderBy(x => x).ToArray();
        int cores = visibleEdge.Count(p => p.Found!.DropletRadius is not null);
        output.WriteLine($"droplet hides the facet: {hidingFound.Count}/{hiding.Count} recognised; droplet radius median error {Median(dropletErr):+0.0%;-0.0%}, wire radius (r_drop·sin {ContactAngle}°) median error {Median(wireErr):+0.0%;-0.0%}");
        output.WriteLine($"droplet on a visible facet: {visibleEdge.Count}/{visible.Count} measured at the facet edge, facet radius median error {Median(facetErr):+0.0%;-0.0%}, droplet core found on {cores}");
        Assert.True(hiding.Count >= 20 && visible.Count >= 20);
        Assert.True(hidingFound.Count >= 0.9 * hiding.Count, $"{hidingFound.Count} of {hiding.Count} bare droplets recognised");
        Assert.InRange(Median(dropletErr), -0.03, 0.03);
        Assert.InRange(Median(wireErr), -0.03, 0.03);
        Assert.True(visibleEdge.Count >= 0.9 * visible.Count, $"{visibleEdge.Count} of {visible.Count} droplet-bearing tops measured at the facet edge");
        Assert.InRange(Median(facetErr), -0.03, 0.03);
    }

    private static double Median(double[] sorted) => sorted.Length == 0 ? double.NaN : sorted[sorted.Length / 2];
}
