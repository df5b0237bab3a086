using System.Globalization;
using System.Text.RegularExpressions;
using Bunit;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Options;
using RunWatch.Core.Model;
using RunWatch.Core.Model.Diffusion;
using RunWatch.Core.Thermal;
using RunWatch.Storage;
using RunWatch.Web.Components.Pages;
using RunWatch.Web.Data;
using RunWatch.Web.Data.Store;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Components.Pages;

/// <summary>The planner on the accepted diffusion model, over the real SQLite store: no model, a plan, extrapolation.</summary>
public sealed partial class PlannerDiffusionTests : IDisposable
{
    private static readonly TimeSpan Plan = TimeSpan.FromSeconds(90);
    private readonly StoreHarness _harness = new();

    public void Dispose() => _harness.Dispose();

    private DashboardTestContext Context()
    {
        var ctx = new DashboardTestContext("viewer");
        ctx.Services.AddSingleton<IDashboardQueries>(_harness.Data);
        ctx.Services.AddSingleton<IDashboardCommands>(_harness.Data);
        ctx.Services.AddSingleton<IPlannerEngine>(new ProcessModelPlanner(Options.Create(new DashboardOptions()), _harness.Wafers));
        ctx.Services.AddSingleton<IGrowthPlanEngine>(new StoreGrowthPlanner(_harness.Store));
        return ctx;
    }

    /// <summary>Invented model: λ(610 °C) = 0.5 µm, E_λ = −1 eV, κ = 1.5, r₀ = 20 nm, calibrated on 590–630 °C and 20–40 min.</summary>
    private async Task<long> SaveModelAsync()
    {
        await _harness.Store.UpsertWaferAsync("W-INV-1", null, "nw-inv", CancellationToken.None);
        double tRef = PhysicalConstants.CelsiusToKelvin(610);
        CaptureLengthLaw law = CaptureLengthLaw.Through(0.5, tRef, -1.0);
        var model = new DiffusionRadiusModel(law.Lambda0SquaredUm2, -1.0, 1.5, 400, tRef, [], 590, 630, 1200, 2400, 1.4);
        ModelFitRecord saved = await _harness.Store.SaveModelFitAsync(new ModelFitRecord
        {
            Process = "nw-inv", Model = ModelKinds.Diffusion, ParamsJson = ModelJson.Serialize(new DiffusionModelParams(model, 1.4)),
        }, CancellationToken.None);
        return saved.Id;
    }

    [Fact]
    public async Task Render_OnlyAProposal_PlainNoModelMessageAndNoDiffusionNumbers()
    {
        await SaveModelAsync();
        using var ctx = Context();

        var page = ctx.Render<Planner>();

        page.WaitForElement("[data-testid=plan-no-diffusion-model]", Plan);
        Assert.Contains("No diffusion model is accepted for process nw-inv", page.Find("[data-testid=plan-no-diffusion-model]").TextContent, StringComparison.Ordinal);
        Assert.Empty(page.FindAll("[data-testid=plan-diffusion-result]"));
    }

    [Fact]
    public async Task Render_AcceptedModel_RadiusDistributionAndDensitySliderMovesIt()
    {
        long id = await SaveModelAsync();
        await _harness.Store.AcceptModelFitAsync(id, "eng-7", CancellationToken.None);
        using var ctx = Context();

        var page = ctx.Render<Planner>();
        page.WaitForElement("[data-testid=plan-diffusion-result]", Plan);
        double crowded = MeanNm(page);
        Assert.Contains("accepted by eng-7", page.Find("[data-testid=plan-diffusion-model]").TextContent, StringComparison.Ordinal);
        Assert.Contains("590.0 °C to 630.0 °C", page.Find("[data-testid=plan-diffusion-model]").TextContent, StringComparison.Ordinal);
        Assert.NotEmpty(page.FindAll("#planner-diffusion-histogram"));
        Assert.Empty(page.FindAll("[data-testid=plan-extrapolation]"));
        Assert.Equal("range", page.Find("[data-testid=plan-density]").GetAttribute("type"));

        page.Find("[data-testid=plan-density]").Change("0.5");
        page.WaitForAssertion(() => Assert.Contains("0.5 µm⁻²", page.Find("[data-testid=plan-density-value]").TextContent, StringComparison.Ordinal), Plan);
        page.WaitForAssertion(() => Assert.True(MeanNm(page) > crowded + 1, $"sparser wires collect more: {MeanNm(page)} vs {crowded} nm"), Plan);
    }

    [Fact]
    public async Task Predict_BeyondCalibratedTemperature_PlainExtrapolationWarning()
    {
        long id = await SaveModelAsync();
        await _harness.Store.AcceptModelFitAsync(id, "eng-7", CancellationToken.None);
        using var ctx = Context();
        var page = ctx.Render<Planner>();
        page.WaitForElement("[data-testid=plan-diffusion-result]", Plan);

        page.Find("[data-testid=plan-temperature]").Change("660");
        page.Find("[data-testid=plan-run]").Click();

        page.WaitForElement("[data-testid=plan-extrapolation]", Plan);
        string warning = page.Find("[data-testid=plan-extrapolation]").TextContent;
        Assert.Contains("660.0 °C lies outside the calibrated 590.0 °C to 630.0 °C", warning, StringComparison.Ordinal);
        Assert.DoesNotContain("min lies outside", warning, StringComparison.Ordinal);
    }

    private static double MeanNm(IRenderedComponent<Planner> page)
    {
        string text = page.Find("[data-testid=plan-diffusion-result]").TextContent;
        return double.Parse(MeanRadius().Match(text).Groups[1].Value, CultureInfo.InvariantCulture);
    }

    [GeneratedRegex(@"Mean radius\s*([\d.]+) nm")]
    private static partial Regex MeanRadius();
}
