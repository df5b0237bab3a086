using Bunit;
using RunWatch.Web.Components.Shared;
using RunWatch.Web.Data;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Components.Shared;

/// <summary>The diffusion model's panels on the Process model and wafer screens (invented figures).</summary>
public sealed class DiffusionPanelsTests
{
    private static DiffusionModelFit Fit(long id, double lambdaNm) => new(id, DashboardTestContext.Now,
        [new DiffusionParameterRow("λ at 610 °C", lambdaNm / 1000, 0.47, 0.59, "µm"), new DiffusionParameterRow("E_λ", -1.1, -1.3, -0.96, "eV"),
         new DiffusionParameterRow("r₀", 20.5, 18.5, double.PositiveInfinity, "nm")],
        610, lambdaNm, 590, 630, 1200, 2400, 1.5, ["W-1", "W-2", "W-3"], 1.5);

    [Fact]
    public void Render_AcceptedAndProposed_ShowsBothWithIntervalsAndWhoAccepted()
    {
        using var ctx = new DashboardTestContext(seed: false);
        var view = new DiffusionModelView(Fit(7, 524), "eng-2", DashboardTestContext.Now, Fit(9, 600), null, null);

        var panel = ctx.Render<DiffusionModelPanel>(p => p.Add(x => x.View, view));

        Assert.Contains("eng-2", panel.Find("[data-testid=diffusion-accepted-by]").TextContent, StringComparison.Ordinal);
        Assert.Contains("-1.3 to -0.96", panel.Find("[data-testid=diffusion-accepted]").TextContent, StringComparison.Ordinal);
        Assert.Contains("unbounded", panel.Find("[data-testid=diffusion-accepted]").TextContent, StringComparison.Ordinal);
        Assert.Contains("600.0 nm", panel.Find("[data-testid=diffusion-proposed]").ParentElement!.TextContent, StringComparison.Ordinal);
        Assert.Empty(panel.FindAll("[data-testid=diffusion-refusal]"));
    }

    [Fact]
    public void Render_RefusedAndNoneAccepted_ShowsTheReasonAndWhatItMeans()
    {
        using var ctx = new DashboardTestContext(seed: false);
        var view = new DiffusionModelView(null, null, null, null, "Every wafer grew at about one temperature (610.0 to 610.1 °C).", DashboardTestContext.Now);

        var panel = ctx.Render<DiffusionModelPanel>(p => p.Add(x => x.View, view));

        Assert.Contains("one temperature", panel.Find("[data-testid=diffusion-refusal]").TextContent, StringComparison.Ordinal);
        Assert.NotNull(panel.Find("[data-testid=diffusion-none-accepted]"));
    }

    [Fact]
    public void Render_WaferFigures_ShowsLambdaLambdaEffAndExtrapolation()
    {
        using var ctx = new DashboardTestContext(seed: false);
        var view = new WaferDiffusionView(7, "Diffusion", 605.2, 1000, 628, 547.4, 525, 658, 34, 86, true);

        var panel = ctx.Render<WaferDiffusionPanel>(p => p.Add(x => x.View, view));

        Assert.Equal("628.0 nm", panel.Find("[data-testid=wafer-lambda]").TextContent.Trim());
        Assert.StartsWith("547.4 nm", panel.Find("[data-testid=wafer-lambda-eff]").TextContent.Trim(), StringComparison.Ordinal);
        Assert.NotNull(panel.Find("[data-testid=wafer-extrapolated]"));
    }
}
