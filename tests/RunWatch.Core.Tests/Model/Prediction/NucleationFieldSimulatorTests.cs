using RunWatch.Core.Model;
using RunWatch.Core.Model.Prediction;
using Xunit;

namespace RunWatch.Core.Tests.Model.Prediction;

public sealed class NucleationFieldSimulatorTests
{
    // r = 0 + 100·Â exactly, so predicted radii are Â scaled by 100.
    private static readonly RadiusModelFit Proportional = RadiusModelFitter.FitLinear([0.1, 0.2, 0.4, 0.8], [10, 20, 40, 80]);

    [Fact]
    public void Predict_PoissonSitesWithLargeL_MeanMatchesMeanCellAreaAndCvMatchesPoissonVoronoi()
    {
        // With L far above the site spacing every unguarded zone is its whole Voronoi cell, so Â = A/(πL²) with
        // ⟨A⟩ = 1/λ (DERIVED: cells tile the plane) and Var(A/⟨A⟩) ≈ 0.280 (Gilbert 1962, FROM MEMORY; the
        // project's notes COMPUTED 0.2808 ± 0.0013). λ = 2.5e8 cm⁻² = 2.5 µm⁻²; L = 2 µm is ≈ 6 mean spacings.
        const double Density = 2.5e8;
        const double L = 2000;
        var request = new RadiusPredictionRequest(Proportional, L, Density, 16, 42);
        RadiusPrediction prediction = NucleationFieldSimulator.Predict(request);

        double meanCellNm2 = 1e14 / Density;
        double expectedMean = 100 * meanCellNm2 / (Math.PI * L * L);
        Assert.InRange(prediction.WireCount, 8000, 12000);
        Assert.InRange(prediction.MeanRadiusNm, expectedMean * 0.98, expectedMean * 1.02);
        double cv2 = prediction.RadiusCv * prediction.RadiusCv;
        Assert.InRange(cv2, 0.265, 0.295);
    }

    [Fact]
    public void Predict_HardCoreSites_AreMoreRegularThanPoisson()
    {
        // DERIVED: a minimum site distance removes the smallest cells, so capture areas (and radii) spread less.
        var request = new RadiusPredictionRequest(Proportional, 2000, 2.5e8, 6, 5);
        RadiusPrediction poisson = NucleationFieldSimulator.Predict(request);
        RadiusPrediction hardCore = NucleationFieldSimulator.Predict(request, new NucleationFieldOptions { Process = NucleationSiteProcess.HardCore, HardCoreDistanceNm = 400 });
        Assert.True(hardCore.RadiusCv < 0.8 * poisson.RadiusCv, $"hard-core CV {hardCore.RadiusCv:0.000} vs Poisson {poisson.RadiusCv:0.000}");
    }

    [Fact]
    public void Predict_SmallL_ZonesAreDiscsAndAreaIsOne()
    {
        // DERIVED: when L is far below half the smallest site distance, every zone is the whole disc: Â = 1.
        var request = new RadiusPredictionRequest(Proportional, 50, 1e8, 2, 9);
        RadiusPrediction prediction = NucleationFieldSimulator.Predict(request, new NucleationFieldOptions { Process = NucleationSiteProcess.HardCore, HardCoreDistanceNm = 200 });
        Assert.Equal(100, prediction.MeanRadiusNm, 6);
        Assert.Equal(0, prediction.RadiusSdNm, 6);
    }

    [Fact]
    public void Predict_SameSeed_SameResult()
    {
        var request = new RadiusPredictionRequest(Proportional, 600, 2e8, 3, 77);
        Assert.Equal(NucleationFieldSimulator.Predict(request), NucleationFieldSimulator.Predict(request));
    }

    [Fact]
    public void Create_HardCoreWithoutDistance_Throws()
    {
        Assert.Throws<ArgumentException>(() => NucleationFieldSimulator.Create(1e8, 500, new NucleationFieldOptions { Process = NucleationSiteProcess.HardCore }));
    }
}
