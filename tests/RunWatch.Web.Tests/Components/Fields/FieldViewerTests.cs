using Bunit;
using Microsoft.Extensions.DependencyInjection;
using RunWatch.Web.Components.Fields;
using RunWatch.Web.Components.Pages;
using RunWatch.Web.Data;
using RunWatch.Web.Data.Fields;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Components.Fields;

public sealed class FieldViewerTests
{
    /// <summary>An invented 400 × 300 px field at 4 nm/px, L = 300 nm: two compared wires, one guarded at the edge.</summary>
    private static FieldDetail Field() => new("7", "uploads/W-2030-A_f7.png", "W-2030-A", FieldQueueState.Done, null, 4, 400, 300, 1200, 300,
        [
            new FieldWireView(1, 600, 600, 40, true, true, 0.9, 38.5),
            new FieldWireView(2, 1000, 500, 44, true, true, 1.1, 46.0),
            new FieldWireView(3, 20, 600, 35, false, true, null, null),
        ],
        [new ParityPoint("7", 1, 38.5, 40), new ParityPoint("7", 2, 46.0, 44), new ParityPoint("8", 5, 41.0, 42)]);

    private static IRenderedComponent<FieldViewer> Render(DashboardTestContext ctx, FieldDetail? field = null)
    {
        ctx.Services.AddSingleton<IFieldDetails>(new OneField(field ?? Field()));
        ctx.JSInterop.SetupModule("./_content/RunWatch.Web/fieldviewer.js");
        return ctx.Render<FieldViewer>(p => p.Add(v => v.FieldId, "7"));
    }

    [Fact]
    public void Render_Field_WiresDrawnInPixelsGuardedMarkedImageAtFullResolution()
    {
        using var ctx = new DashboardTestContext();
        var page = Render(ctx);

        Assert.Equal("0 0 400 300", page.Find("[data-testid=field-svg]").GetAttribute("viewBox"));
        Assert.Equal("api/fields/7/full?layer=plain", page.Find("[data-testid=field-image]").GetAttribute("href"));
        var wires = page.FindAll("[data-testid=wire]");
        Assert.Equal(3, wires.Count);
        Assert.Equal(("150", "150", "10"), (wires[0].GetAttribute("cx"), wires[0].GetAttribute("cy"), wires[0].GetAttribute("r")));
        Assert.Contains("guarded", wires[2].ClassName, StringComparison.Ordinal);
        Assert.Contains("tilted", wires[2].ClassName, StringComparison.Ordinal);
        Assert.Single(page.FindAll("[data-testid=guard-marks] path"));
        Assert.Equal("false", wires[2].GetAttribute("data-compared"));
        Assert.Contains("L = 300.0 nm", page.Find("[data-testid=field-facts]").TextContent, StringComparison.Ordinal);
    }

    [Fact]
    public void ClickWire_ShowsFiguresAndRingsItsPoint_ChartPointSelectsWire()
    {
        using var ctx = new DashboardTestContext();
        var page = Render(ctx);

        page.Find("[data-testid=wire][data-wire='2']").Click();
        Assert.Equal("2", page.Find("[data-testid=wire-figures]").GetAttribute("data-wire"));
        Assert.Equal("7/2", page.Find("[data-testid=linked-parity]").GetAttribute("data-selected"));
        Assert.Equal("46.0 nm", page.Find("[data-testid=wire-predicted]").TextContent);
        Assert.Contains("−2.0 nm", page.Find("[data-testid=wire-figures]").TextContent, StringComparison.Ordinal);
        Assert.Equal("2", page.Find("[data-testid=selected-wire]").GetAttribute("data-wire"));

        var chart = page.FindComponent<LinkedParityChart>();
        page.InvokeAsync(() => chart.Instance.PointClicked.InvokeAsync(new ParityPoint("7", 1, 38.5, 40)));
        Assert.Equal("1", page.Find("[data-testid=wire-figures]").GetAttribute("data-wire"));
        Assert.Equal("7/1", page.Find("[data-testid=linked-parity]").GetAttribute("data-selected"));

        // A point of another field opens that field with the wire chosen.
        page.InvokeAsync(() => chart.Instance.PointClicked.InvokeAsync(new ParityPoint("8", 5, 41, 42)));
        Assert.EndsWith("fields/8?wire=5", ctx.Services.GetRequiredService<Microsoft.AspNetCore.Components.NavigationManager>().Uri, StringComparison.Ordinal);
    }

    [Fact]
    public void Overlays_Toggled_ZonesLabelsOutlinesAndImageLayer()
    {
        using var ctx = new DashboardTestContext();
        var page = Render(ctx);
        Assert.Empty(page.FindAll("[data-testid=zones] polygon"));

        page.Find("[data-testid=show-zones]").Change(true);
        page.Find("[data-testid=show-labels]").Change(true);
        page.Find("[data-testid=show-outlines]").Change(false);
        page.Find("[data-testid=layer]").Change("analysis");

        Assert.Equal(3, page.FindAll("[data-testid=zones] polygon").Count);
        Assert.Equal(["1", "2", "3"], page.FindAll("[data-testid=labels] text").Select(t => t.TextContent));
        Assert.All(page.FindAll("[data-testid=wire]"), w => Assert.Equal("wire-hit", w.ClassName));
        Assert.Equal("api/fields/7/full?layer=analysis", page.Find("[data-testid=field-image]").GetAttribute("href"));
        page.Find("[data-testid=layer]").Change("none");
        Assert.Empty(page.FindAll("[data-testid=field-image]"));
    }

    [Fact]
    public void Render_NotAnalysedOrUnknown_SaysSo()
    {
        using var ctx = new DashboardTestContext();
        var page = Render(ctx, new FieldDetail("7", "f.png", null, FieldQueueState.WaitingForWafer, "no wafer id in the file name or sidecar", double.NaN, 0, 0, double.NaN, null, [], []));
        Assert.NotNull(page.Find("[data-testid=not-analysed]"));
        Assert.Contains("WAITING FOR WAFER", page.Markup, StringComparison.Ordinal);
        Assert.DoesNotContain("NaN", page.Markup, StringComparison.Ordinal);
    }

    private sealed class OneField(FieldDetail field) : IFieldDetails
    {
        public Task<FieldDetail?> GetFieldAsync(string fieldId, CancellationToken cancellationToken) => Task.FromResult(fieldId == field.FieldId ? field : null);

        public Task<ReportFile?> GetFullImageAsync(string fieldId, bool analysisDrawn, CancellationToken cancellationToken) => Task.FromResult<ReportFile?>(null);
    }
}
