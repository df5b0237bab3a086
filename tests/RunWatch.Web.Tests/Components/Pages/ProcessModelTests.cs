using Bunit;
using RunWatch.Web.Components.Pages;
using RunWatch.Testing.Dashboard;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Components.Pages;

public sealed class ProcessModelTests
{
    [Fact]
    public void Render_NoModel_SaysWhenOneAppears()
    {
        using var ctx = new DashboardTestContext(seed: false);
        Assert.NotNull(ctx.Render<ProcessModel>().Find("[data-testid=no-model]"));
    }

    [Fact]
    public async Task RefitThenAccept_Engineer_ModelInForceChangesAndRecordsWho()
    {
        using var ctx = new DashboardTestContext();
        var page = ctx.Render<ProcessModel>();
        Assert.Contains("r = 20.4 nm + 21.6 nm · Â", page.Find("[data-testid=fit-current]").TextContent, StringComparison.Ordinal);

        page.Find("[data-testid=refit]").Click();
        page.Find("[data-testid=accept]").Click();

        var model = await ctx.Data.GetProcessModelAsync(InventedLabScenario.Process, CancellationToken.None);
        Assert.Equal("test-engineer", model!.AcceptedBy);
        Assert.Null(model.Candidate);
        // DERIVED: the scenario's wires scatter ±3.5 nm around r = 20 + 22·Â, so an OLS refit lands near those values.
        Assert.InRange(model.Current.A, 18, 22);
        Assert.InRange(model.Current.B, 19, 25);
    }
}
