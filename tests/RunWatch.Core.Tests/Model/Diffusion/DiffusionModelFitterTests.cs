using RunWatch.Core.Geometry;
using RunWatch.Core.Model.Diffusion;
using RunWatch.Core.Thermal;
using Xunit;
using Xunit.Abstractions;

namespace RunWatch.Core.Tests.Model.Diffusion;

/// <summary>The fitter refuses data that cannot locate λ, with a plain reason.</summary>
public sealed class DiffusionModelFitterTests(ITestOutputHelper output)
{
    [Fact]
    public void Fit_TwoWafers_RefusesAskingForThree()
    {
        DiffusionWafer a = VoronoiWafer("A", 590, 1800, 1, 0.2, 0.3), b = VoronoiWafer("B", 630, 1800, 2, 0.2, 0.3);

        DiffusionFitResult result = DiffusionModelFitter.Fit([a, b]);

        Assert.False(result.Succeeded);
        Assert.Contains("at least 3", result.Refusal, StringComparison.Ordinal);
    }

    [Fact]
    public void Fit_OneTemperatureThreeTimes_RefusesNamingTheTemperature()
    {
        DiffusionWafer[] wafers =
        [
            VoronoiWafer("A", 610, 1200, 1, 0.2, 0.3),
            VoronoiWafer("B", 610, 1800, 2, 0.2, 0.3),
            VoronoiWafer("C", 611, 2400, 3, 0.2, 0.3),
        ];

        DiffusionFitResult result = DiffusionModelFitter.Fit(wafers);

        Assert.False(result.Succeeded);
        Assert.Contains("one temperature", result.Refusal, StringComparison.Ordinal);
    }

    /// <summary>
    /// Radii made from the wires' Voronoi cells (the geometry room's capture zones at L = ∞, an independent
    /// computation of the λ → ∞ limit) at three temperatures: nothing in them depends on λ, so the fit must refuse.
    /// </summary>
    [Fact]
    public void Fit_VoronoiLimitedRadii_RefusesBecauseLambdaIsNotLocated()
    {
        DiffusionWafer[] wafers =
        [
            VoronoiWafer("A", 590, 1800, 1, 2, 8, 10),
            VoronoiWafer("B", 610, 1800, 2, 2, 8, 10),
            VoronoiWafer("C", 630, 1200, 3, 2, 8, 10),
        ];

        DiffusionFitResult result = DiffusionModelFitter.Fit(wafers);

        output.WriteLine(result.Refusal ?? "fitted");
        Assert.False(result.Succeeded);
        Assert.Contains("λ", result.Refusal, StringComparison.Ordinal);
    }

    private static DiffusionWafer VoronoiWafer(string id, double temperatureC, double seconds, int seed, double lambdaMin, double lambdaMax, double widthUm = 4)
    {
        var field = CaptureField.Rectangle(widthUm, 0.8 * widthUm);
        (Point2D[] centres, double[] radii) = DiffusionTestFields.Poisson(field, 3.0, seed);
        CaptureZoneResult zones = CaptureZones.Compute(centres, field);
        var random = new Random(seed);
        var measured = new double[centres.Length];
        for (int i = 0; i < measured.Length; i++)
        {
            measured[i] = Math.Sqrt(400 + (2.5 * zones.Areas[i] * seconds)) + random.NextDouble() - 0.5;
        }
        double[] footprints = measured.Select(GrowthFootprint.FootprintUm).ToArray();
        CaptureAreaTable table = CaptureAreaTable.Build(centres, footprints, field, lambdaMin, lambdaMax);
        return new DiffusionWafer(id, table, ThermalExposure.Isothermal(PhysicalConstants.CelsiusToKelvin(temperatureC), seconds), measured);
    }
}
