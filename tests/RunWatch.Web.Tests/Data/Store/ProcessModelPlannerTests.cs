using Microsoft.Extensions.Options;
using RunWatch.Core.Model;
using ArrheniusFit = RunWatch.Core.Model.ArrheniusFit;
using ArrheniusPoint = RunWatch.Core.Model.ArrheniusPoint;
using RunWatch.Storage;
using RunWatch.Web.Data;
using RunWatch.Web.Data.Store;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Data.Store;

/// <summary>The planner over the store uses the process's accepted model, and says so.</summary>
public sealed class ProcessModelPlannerTests : IDisposable
{
    // CONFIRMED (CHECKS.md §1): kB = k/e from the exact SI constants.
    private const double BoltzmannEvPerK = 1.380649e-23 / 1.602176634e-19;
    private const string Process = "nw-plan";
    private readonly StoreHarness _harness = new();
    private readonly ProcessModelPlanner _planner;

    public ProcessModelPlannerTests()
    {
        _planner = new ProcessModelPlanner(Options.Create(new DashboardOptions()), _harness.Wafers);
    }

    public void Dispose() => _harness.Dispose();

    /// <summary>600 °C held for 30 min, 1.4 sites/µm².</summary>
    private static PlannerInput Plan(string process = Process) => new(process, [new ProfilePoint(0, 600), new ProfilePoint(30, 600)], TimeSpan.FromMinutes(30), 1.4);

    /// <summary>Hand formula (DERIVED): L = √(c·D0·exp(−Ea/(kB·T))·t) at constant T, in nm.</summary>
    private static double HandLengthNm(double c, double d0, double ea, double temperatureC, double seconds) =>
        Math.Sqrt(c * d0 * Math.Exp(-ea / (BoltzmannEvPerK * (temperatureC + 273.15))) * seconds) * 1e7;

    private async Task ProposeRadiusAsync(double a, double b)
    {
        var fit = new RadiusModelFit(RadiusModelKind.Linear, [new ParameterEstimate("a", a, 0.1, a - 0.2, a + 0.2, "nm"), new ParameterEstimate("b", b, 0.1, b - 0.2, b + 0.2, "nm")],
            300, 0.9, 0.9, 2, 2, 100, 0);
        await _harness.Store.SaveModelFitAsync(new ModelFitRecord { Process = Process, Model = "radius", FittedAt = DateTimeOffset.UtcNow, ParamsJson = ModelJson.Serialize(fit), RSquared = 0.9, RmseNm = 2, Wafers = ["W-P1"] },
            CancellationToken.None);
    }

    private async Task ProposeArrheniusAsync(double d0, double ea, double conventionFactor)
    {
        string[] wafers = ["W-P1", "W-P2", "W-P3"];
        foreach (string w in wafers)
        {
            await _harness.Store.SaveModelFitAsync(new ModelFitRecord
            {
                Process = Process, Model = "capture-radius", FittedAt = DateTimeOffset.UtcNow, Wafers = [w],
                ParamsJson = ModelJson.Serialize(new ArrheniusPoint(w, 2000, 1800, 873.15, conventionFactor)),
            }, CancellationToken.None);
        }
        var fit = new ArrheniusFit(new ParameterEstimate("Ea", ea, 0.01, ea - 0.02, ea + 0.02, "eV"), new ParameterEstimate("D0", d0, d0 * 0.1, d0 * 0.8, d0 * 1.2, "cm²/s"),
            new ParameterEstimate("ln D0", Math.Log(d0), 0.1, Math.Log(d0) - 0.2, Math.Log(d0) + 0.2, "ln(cm²/s)"), 3, 0.99, 0.05, wafers);
        await _harness.Store.SaveModelFitAsync(new ModelFitRecord { Process = Process, Model = "arrhenius", FittedAt = DateTimeOffset.UtcNow, ParamsJson = ModelJson.Serialize(fit), RSquared = 0.99, Wafers = wafers },
            CancellationToken.None);
    }

    [Fact]
    public async Task PredictAsync_AcceptedModelChanged_RadiiAndLengthFollowTheModel()
    {
        await ProposeRadiusAsync(10, 20);
        await ProposeArrheniusAsync(2e-4, 1.3, 4);
        await _harness.Data.AcceptModelAsync(Process, "eng-1", CancellationToken.None);
        PlannerResult first = await _planner.PredictAsync(Plan(), CancellationToken.None);

        await ProposeRadiusAsync(15, 40);
        await _harness.Data.AcceptModelAsync(Process, "eng-2", CancellationToken.None);
        PlannerResult second = await _planner.PredictAsync(Plan(), CancellationToken.None);

        await ProposeArrheniusAsync(2e-4, 1.2, 4);
        await _harness.Data.AcceptModelAsync(Process, "eng-3", CancellationToken.None);
        PlannerResult third = await _planner.PredictAsync(Plan(), CancellationToken.None);

        // L from the accepted calibration and its convention factor c = 4.
        Assert.Equal(HandLengthNm(4, 2e-4, 1.3, 600, 1800), first.LEffNm, first.LEffNm * 1e-9);
        Assert.Equal(600, first.TEffC, 1e-6);
        Assert.Equal(first.LEffNm, second.LEffNm);
        Assert.Equal(HandLengthNm(4, 2e-4, 1.2, 600, 1800), third.LEffNm, third.LEffNm * 1e-9);
        // Same L and seed give the same capture areas Â, so each wire's radius follows the model (DERIVED):
        // r₂ = 15 + 40·Â = 15 + 2·(r₁ − 10).
        Assert.Equal(first.RadiiNm.Count, second.RadiiNm.Count);
        for (int i = 0; i < first.RadiiNm.Count; i++)
        {
            Assert.Equal(15 + (2 * (first.RadiiNm[i] - 10)), second.RadiiNm[i], 1e-9);
        }
        Assert.True(first.RadiiNm.Count > 100);
        // A zone clipped by the disc of radius L has Â = area/(πL²) in (0, 1] (DERIVED), so r = 10 + 20·Â lies in (10, 30].
        Assert.All(first.RadiiNm, r => Assert.InRange(r, 10, 30 + 1e-6));
        PlannerModel model = second.Model!;
        Assert.Equal((RadiusModelForm.Linear, 15.0, 40.0), (model.RadiusForm, model.RadiusA, model.RadiusB));
        Assert.Equal("eng-2", model.RadiusAcceptedBy);
        Assert.Equal("eng-1", model.DiffusivityAcceptedBy);
        Assert.Equal("eng-3", third.Model!.DiffusivityAcceptedBy);
        Assert.False(model.RadiusIsDefault);
    }

    [Fact]
    public async Task PredictAsync_OnlyProposedModel_UsesConfiguredDefaultsAndSaysSo()
    {
        await ProposeRadiusAsync(15, 40);
        await ProposeArrheniusAsync(2e-4, 1.3, 4);

        PlannerResult result = await _planner.PredictAsync(Plan(), CancellationToken.None);

        var defaults = new PlannerOptions();
        Assert.True(result.Model!.RadiusIsDefault);
        Assert.True(result.Model.DiffusivityIsDefault);
        Assert.Equal(defaults.RadiusInterceptNm, result.Model.RadiusA);
        Assert.Equal(HandLengthNm(1, defaults.D0CmSquaredPerSecond, defaults.ActivationEnergyEv, 600, 1800), result.LEffNm, result.LEffNm * 1e-9);
    }

    [Fact]
    public async Task PredictAsync_InvalidInput_RefusedWithMessage()
    {
        var ex = await Assert.ThrowsAsync<ArgumentException>(() => _planner.PredictAsync(Plan() with { NucleationDensityPerSquareMicrometre = 0 }, CancellationToken.None));

        Assert.Contains("positive nucleation density", ex.Message, StringComparison.Ordinal);
        var cold = await Assert.ThrowsAsync<ArgumentException>(() => _planner.PredictAsync(Plan() with { Profile = [new ProfilePoint(0, -300), new ProfilePoint(30, 600)] },
            CancellationToken.None));
        Assert.Contains("above absolute zero", cold.Message, StringComparison.Ordinal);
    }
}
