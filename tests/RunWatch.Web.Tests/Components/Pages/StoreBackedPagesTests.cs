using AngleSharp.Dom;
using Bunit;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Options;
using RunWatch.Core.Model;
using RunWatch.Core.Safety;
using RunWatch.Core.Wafers;
using RunWatch.Storage;
using RunWatch.Web.Components.Pages;
using RunWatch.Web.Data;
using RunWatch.Web.Data.Store;
using RunWatch.Web.Safety;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Components.Pages;

/// <summary>Settings, process model and planner pages over the real SQLite store: who may edit, what is refused, what is shown.</summary>
public sealed class StoreBackedPagesTests : IDisposable
{
    private readonly StoreHarness _harness = new(new RecordingRefitter());

    public void Dispose() => _harness.Dispose();

    private DashboardTestContext Context(string role)
    {
        var ctx = new DashboardTestContext(role);
        ctx.Services.AddSingleton<IDashboardQueries>(_harness.Data);
        ctx.Services.AddSingleton<IDashboardCommands>(_harness.Data);
        ctx.Services.AddSingleton<IPlannerEngine>(new ProcessModelPlanner(Options.Create(new DashboardOptions()), _harness.Wafers));
        var rules = new ReminderRuleSet(DefaultReminders.All);
        ctx.Services.AddSingleton(rules);
        ctx.Services.AddSingleton(sp => new ReminderRuleEditor(rules, _harness.Data, sp.GetRequiredService<DashboardClock>(), _harness.Store));
        return ctx;
    }

    private static IElement MeanRadiusRow(IRenderedComponent<Settings> page) =>
        page.FindAll("[data-testid=spec-row]").Single(r => r.TextContent.Contains("mean radius", StringComparison.Ordinal));

    [Theory]
    [InlineData("viewer")]
    [InlineData("engineer")]
    public async Task SaveSpec_NotAdmin_RefusedAndStoreUnchanged(string role)
    {
        using var ctx = Context(role);
        var page = ctx.Render<Settings>();

        MeanRadiusRow(page).QuerySelector("[data-testid=spec-save]")!.Click();

        Assert.Contains("Refused: editing specs needs the admin role", page.Find("[data-testid=settings-message]").TextContent, StringComparison.Ordinal);
        Assert.All(page.FindAll("[data-testid=specs] input"), i => Assert.True(i.HasAttribute("disabled")));
        Assert.Equal(45, (await _harness.Catalog.SpecificationForAsync("nw-inv", CancellationToken.None)).TargetMeanRadiusNm);
        Assert.DoesNotContain(await _harness.Store.GetAuditAsync(20, CancellationToken.None), a => a.Action == "spec edited");
    }

    [Fact]
    public async Task SaveSpec_FractionShownInPercent_StoredAsFraction()
    {
        using var ctx = Context("admin");
        var page = ctx.Render<Settings>();
        var cv = page.FindAll("[data-testid=spec-row]").Single(r => r.TextContent.Contains("radius CV", StringComparison.Ordinal) && r.TextContent.Contains("nw-inv", StringComparison.Ordinal));
        string shown = cv.QuerySelector("[data-testid=spec-max]")!.GetAttribute("value")!;
        string unit = cv.QuerySelectorAll("td")[6].TextContent;

        cv.QuerySelector("[data-testid=spec-max]")!.Change("40");
        page.FindAll("[data-testid=spec-row]").Single(r => r.TextContent.Contains("radius CV", StringComparison.Ordinal) && r.TextContent.Contains("nw-inv", StringComparison.Ordinal))
            .QuerySelector("[data-testid=spec-save]")!.Click();

        // Stored 0.35 is shown as 35 %; 40 % typed is stored as 0.40.
        Assert.Equal("35", shown);
        Assert.Equal("%", unit);
        Assert.Equal(0.40, (await _harness.Catalog.SpecificationForAsync("nw-inv", CancellationToken.None)).MaxRadiusCv!.Value, 12);
    }

    [Fact]
    public async Task SaveSpec_AdminInvalid_ShowsReasonAndStoreUnchanged()
    {
        using var ctx = Context("admin");
        var page = ctx.Render<Settings>();

        MeanRadiusRow(page).QuerySelector("[data-testid=spec-min]")!.Change("60"); // above the maximum 55
        MeanRadiusRow(page).QuerySelector("[data-testid=spec-save]")!.Click();

        Assert.Contains("must be below the upper", page.Find("[data-testid=settings-message]").TextContent, StringComparison.Ordinal);
        Assert.Equal(10, (await _harness.Catalog.SpecificationForAsync("nw-inv", CancellationToken.None)).MeanRadiusToleranceNm);
    }

    [Fact]
    public async Task SaveSpecAndRule_Admin_StoredAndAuditShownOnPage()
    {
        using var ctx = Context("admin");
        var page = ctx.Render<Settings>();

        MeanRadiusRow(page).QuerySelector("[data-testid=spec-max]")!.Change("51");
        MeanRadiusRow(page).QuerySelector("[data-testid=spec-min]")!.Change("39");
        MeanRadiusRow(page).QuerySelector("[data-testid=spec-warn-min]")!.Change("");
        MeanRadiusRow(page).QuerySelector("[data-testid=spec-warn-max]")!.Change("");
        MeanRadiusRow(page).QuerySelector("[data-testid=spec-save]")!.Click();
        var vent = page.FindAll("[data-testid=rule-row]").Single(r => r.TextContent.Contains("Substrate above venting limit", StringComparison.Ordinal));
        vent.QuerySelector("[data-testid=rule-threshold]")!.Change("180");
        page.FindAll("[data-testid=rule-row]").Single(r => r.TextContent.Contains("Substrate above venting limit", StringComparison.Ordinal))
            .QuerySelector("[data-testid=rule-save]")!.Click();

        var spec = await _harness.Catalog.SpecificationForAsync("nw-inv", CancellationToken.None);
        Assert.Equal((45.0, 6.0), (spec.TargetMeanRadiusNm!.Value, spec.MeanRadiusToleranceNm!.Value));
        Assert.Null(spec.MeanRadiusWarnToleranceNm);
        Assert.Equal(180, (await _harness.Store.GetReminderSettingsAsync(CancellationToken.None)).Single(s => s.RuleId == "substrate-above-vent-limit").Threshold);
        string audit = page.Find("[data-testid=audit]").TextContent;
        Assert.Contains("spec edited", audit, StringComparison.Ordinal);
        Assert.Contains("reminder edited", audit, StringComparison.Ordinal);
        Assert.Contains("threshold 200 → 180 °C", audit, StringComparison.Ordinal);
        Assert.Contains("test-admin", audit, StringComparison.Ordinal);
    }

    [Fact]
    public async Task SaveRule_Engineer_Refused()
    {
        using var ctx = Context("engineer");
        var page = ctx.Render<Settings>();

        page.FindAll("[data-testid=rule-save]")[0].Click();

        Assert.Contains("Refused: editing reminders needs the admin role", page.Find("[data-testid=settings-message]").TextContent, StringComparison.Ordinal);
        Assert.Empty(await _harness.Store.GetReminderSettingsAsync(CancellationToken.None)); // nothing was written, not even a seed
    }

    [Fact]
    public async Task Refit_ViewerRefusedEngineerRecorded()
    {
        await _harness.Store.UpsertWaferAsync("W-INV-1", null, "nw-inv", CancellationToken.None);
        await _harness.Store.SaveModelFitAsync(new ModelFitRecord { Process = "nw-inv", Model = "radius", ParamsJson = """{"kind":"Linear","parameters":[{"value":20},{"value":22}],"count":10}""" },
            CancellationToken.None);
        using (var viewer = Context("viewer"))
        {
            var page = viewer.Render<ProcessModel>();
            page.Find("[data-testid=refit]").Click();
            Assert.Contains("Refused", page.Find("[data-testid=model-message]").TextContent, StringComparison.Ordinal);
        }
        Assert.Equal(0, ((RecordingRefitter)_harness.Refitter!).Calls);

        using var engineer = Context("engineer");
        var enginePage = engineer.Render<ProcessModel>();
        enginePage.Find("[data-testid=refit]").Click();

        Assert.Equal(1, ((RecordingRefitter)_harness.Refitter!).Calls);
        var entry = Assert.Single(await _harness.Store.GetAuditAsync(10, CancellationToken.None), a => a.Action == "model refitted");
        Assert.Equal("test-engineer", entry.Actor);
        Assert.Equal("nw-inv", entry.Subject);
        Assert.Equal("proposed a test refit", AuditDetail.Text(entry.DetailJson));
    }

    [Fact]
    public async Task GetProcessModelAsync_StoredAnalyses_RadiusDataAreTheCountedWires()
    {
        await _harness.Store.UpsertWaferAsync("W-INV-1", null, "nw-inv", CancellationToken.None);
        var (field, _) = await _harness.Store.AddFieldAsync(new FieldRecord { Wafer = "W-INV-1", FilePath = "f.png", RelativePath = "f.png", Sha256 = "s1", Status = FieldStatus.Analysed },
            CancellationToken.None);
        // As the pipeline stores a field result: one counted wire, one leaning, one at the edge, one guarded.
        await _harness.Store.SaveAnalysisAsync(new AnalysisRecord
        {
            FieldId = field.Id, Status = "done",
            ResultsJson = FieldResultJson.Write(new FieldResult
            {
                FieldName = "f.png", PixelSizeNm = 5, WidthNm = 5000, AnalysedHeightNm = 4000, Threshold = "invented", AnalysedAreaCm2 = 2e-7,
                Wires =
                [
                    new FieldWire(0, 100, 100, 31.5, Vertical: true, Interior: true, ZoneNormalised: 0.8),
                    new FieldWire(1, 200, 100, 30, Vertical: false, Interior: true, ZoneNormalised: 0.7),
                    new FieldWire(2, 300, 100, 29, Vertical: true, Interior: false, ZoneNormalised: 0.6),
                    new FieldWire(3, 400, 100, 28, Vertical: true, Interior: true, ZoneNormalised: null),
                ],
            }),
        }, CancellationToken.None);
        await _harness.Store.SaveModelFitAsync(new ModelFitRecord { Process = "nw-inv", Model = "radius", ParamsJson = """{"kind":"Linear","parameters":[{"value":20},{"value":22}],"count":1}""" },
            CancellationToken.None);

        ProcessModelView view = (await _harness.Data.GetProcessModelAsync("nw-inv", CancellationToken.None))!;

        Assert.Equal(new ModelPoint(0.8, 31.5, "W-INV-1"), Assert.Single(view.RadiusData));
    }

    [Fact]
    public async Task Planner_AcceptedModel_ShowsWhoAcceptedIt()
    {
        await _harness.Store.UpsertWaferAsync("W-INV-1", null, "nw-inv", CancellationToken.None);
        var fit = new RadiusModelFit(RadiusModelKind.Linear, [new ParameterEstimate("a", 12, 0, 12, 12, "nm"), new ParameterEstimate("b", 25, 0, 25, 25, "nm")], 50, 0.9, 0.9, 1, 1, 0, 0);
        await _harness.Store.SaveModelFitAsync(new ModelFitRecord { Process = "nw-inv", Model = "radius", ParamsJson = ModelJson.Serialize(fit) }, CancellationToken.None);
        using (var before = Context("viewer"))
        {
            var page = before.Render<Planner>();
            Assert.Contains("No accepted model for process nw-inv", page.Find("[data-testid=plan-model-default]").TextContent, StringComparison.Ordinal);
            Assert.Contains("configured default", page.Find("[data-testid=plan-model-radius]").TextContent, StringComparison.Ordinal);
        }

        await _harness.Data.AcceptModelAsync("nw-inv", "eng-7", CancellationToken.None);
        using var after = Context("viewer");
        var accepted = after.Render<Planner>();

        string radius = accepted.Find("[data-testid=plan-model-radius]").TextContent;
        Assert.Contains("r = 12 nm + 25 nm · Â", radius, StringComparison.Ordinal);
        Assert.Contains("accepted for nw-inv by eng-7", radius, StringComparison.Ordinal);
        Assert.Contains("configured default", accepted.Find("[data-testid=plan-model-diffusivity]").TextContent, StringComparison.Ordinal);
        Assert.Empty(accepted.FindAll("[data-testid=plan-model-default]"));
    }

    /// <summary>Stands in for the wafer pipeline's refit; counts calls.</summary>
    private sealed class RecordingRefitter : IModelRefitter
    {
        public int Calls { get; private set; }

        public Task<string> RefitAsync(string process, CancellationToken cancellationToken)
        {
            Calls++;
            return Task.FromResult("proposed a test refit");
        }
    }
}
