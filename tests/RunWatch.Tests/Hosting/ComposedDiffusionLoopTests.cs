using System.Globalization;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using RunWatch.Core.Geometry;
using RunWatch.Core.Model;
using RunWatch.Core.Model.Diffusion;
using RunWatch.Core.Qc;
using RunWatch.Core.Thermal;
using RunWatch.Core.Wafers;
using RunWatch.Hosting;
using RunWatch.Ingest.Chambers;
using RunWatch.Ingest.Runs;
using RunWatch.Storage;
using RunWatch.Testing.Mqtt;
using RunWatch.Testing.Physics;
using RunWatch.Wafers.Pipeline;
using RunWatch.Web.Data;
using Xunit;
using Xunit.Abstractions;

namespace RunWatch.Tests.Hosting;

/// <summary>
/// The loop in the program as <c>runwatch serve</c> composes it, on a real SQLite file: wafers grown at three
/// temperatures (truth from the adatom random walk, never from the model under test) with their runs' records →
/// refit from the Process model screen's command → a diffusion-model proposal, unused until a person accepts it →
/// the next run's run-end estimate and the next wafer's verdict use the accepted model, and the verdict's prediction
/// agrees with the truth. A refit on data without information is refused with its reason, which the screen shows.
/// </summary>
public sealed class ComposedDiffusionLoopTests(ITestOutputHelper output) : IDisposable
{
    private const string Process = "nw-inv-loop";
    private const string FlatProcess = "nw-inv-flat";
    private static readonly DateTimeOffset T0 = new(2026, 3, 2, 6, 0, 0, TimeSpan.Zero);
    private readonly string _folder = Directory.CreateTempSubdirectory("runwatch-composed-loop-").FullName;

    public void Dispose()
    {
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
        Directory.Delete(_folder, recursive: true);
    }

    private async Task<WebApplication> StartAsync()
    {
        var settings = new Dictionary<string, string?>
        {
            ["Urls"] = "http://127.0.0.1:" + FreePort.Next().ToString(CultureInfo.InvariantCulture),
            ["ChambersFile"] = Path.Combine(_folder, "none.json"),
            ["Storage:DataDirectory"] = _folder,
            ["Broker:Mode"] = "Embedded",
            ["Broker:Host"] = "127.0.0.1",
            ["Broker:Port"] = FreePort.Next().ToString(CultureInfo.InvariantCulture),
            ["Chambers:0:Name"] = "c1",
            ["Chambers:0:Site"] = "invented lab",
            ["Chambers:0:Channels:0:Name"] = "substrate_tc",
            ["Chambers:0:Channels:0:Role"] = "GrowthTemperature",
            ["Chambers:0:Channels:0:Unit"] = "degC",
            // The truth's λ stays within 0.15–3 µm at every temperature used here.
            ["WaferPipeline:CalibrationLambdaMinUm"] = "0.15",
            [$"Qc:Recipes:{Process}:MaxAbsBiasNm"] = "2",
            [$"Qc:Recipes:{Process}:MinWireCount"] = "10",
            [$"Qc:Recipes:{FlatProcess}:MinWireCount"] = "10",
        };
        var builder = WebApplication.CreateBuilder(new WebApplicationOptions { EnvironmentName = Environments.Development, ApplicationName = "runwatch" });
        builder.Configuration.AddInMemoryCollection(settings);
        builder.WebHost.UseStaticWebAssets();
        builder.AddRunWatch([]);
        var app = builder.Build();
        app.MapRunWatch();
        await app.StartAsync();
        return app;
    }

    /// <summary>A closed run of <paramref name="record"/> starting at <paramref name="start"/>, its samples stored, one wafer with one analysed field of <paramref name="truth"/>.</summary>
    private static async Task<RunRecord> GrowAsync(WebApplication app, string process, string wafer, DateTimeOffset start, ThermalRecord record,
        (Point2D[] Centres, double[] RadiiNm, CaptureField Field) truth)
    {
        var store = app.Services.GetRequiredService<IRunWatchStore>();
        var wafers = app.Services.GetRequiredService<IWaferStore>();
        ChamberRuntime chamber = app.Services.GetRequiredService<ChamberRegistryHolder>().Registry.All.Single(c => c.Name == "c1");
        var batch = new IngestBatch();
        for (int i = 0; i < record.Count; i++)
        {
            batch.AddSample(new SampleRow(chamber.ChamberId, chamber.GrowthTemperature!.ChannelId, UnixMicros.From(start.AddSeconds(record.TimesS[i])), i, record.ReadingsC[i]));
        }
        await store.WriteBatchAsync(batch, CancellationToken.None);
        double seconds = record.TimesS[^1];
        RunRecord run = await store.SaveRunAsync(new RunRecord
        {
            Chamber = "c1", Name = "R-" + wafer, Recipe = process, Wafers = [wafer], Status = RunStatus.Closed, StartedAt = start, EndedAt = start.AddSeconds(seconds),
            SetpointC = Math.Round(record.ReadingsC[0]), PlannedSeconds = seconds,
        }, CancellationToken.None);
        await wafers.UpsertWaferAsync(wafer, run.Id, process, CancellationToken.None);
        var (field, _) = await wafers.AddFieldAsync(new FieldRecord
        {
            Wafer = wafer, FilePath = "fields/" + wafer + ".png", RelativePath = wafer + ".png", Sha256 = "sha-" + wafer, Status = FieldStatus.Analysed, NmPerPx = 10,
        }, CancellationToken.None);
        FieldResult result = GrowthTruthFields.ToField(wafer + ".png", truth);
        await wafers.SaveAnalysisAsync(new AnalysisRecord { FieldId = field.Id, Status = "done", ResultsJson = FieldResultJson.Write(result) }, CancellationToken.None);
        return run;
    }

    [Fact]
    public async Task RefitAcceptAndNextRun_OverComposedHost_ProposalUnusedUntilAcceptedThenRunEndAndVerdictUseItAndAgreeWithTruth()
    {
        await using var app = await StartAsync();
        var wafers = app.Services.GetRequiredService<IWaferStore>();
        var commands = app.Services.GetRequiredService<IDashboardCommands>();
        var queries = app.Services.GetRequiredService<IDashboardQueries>();
        var reports = app.Services.GetRequiredService<WaferReportService>();
        var evaluator = app.Services.GetRequiredService<RunEvaluator>();
        ChamberRuntime chamber = app.Services.GetRequiredService<ChamberRegistryHolder>().Registry.All.Single(c => c.Name == "c1");

        // Calibration wafers: 590 °C for 30 min, 610 °C for 20 min, 630 °C for 40 min (invented), radii from the random walk.
        (double C, double S)[] conditions = [(590, 1800), (610, 1200), (630, 2400)];
        for (int k = 0; k < conditions.Length; k++)
        {
            ThermalRecord record = GrowthTruth.Record(conditions[k].C, conditions[k].S, 1 + k);
            await GrowAsync(app, Process, $"W-LOOP-{k + 1}", T0.AddHours(k), record, GrowthTruth.Wafer(record, GrowthTruth.Law, 100 + k));
        }
        // Before any model: no run-end radius estimate, and the verdict says why and what to do.
        RunRecord first = (await wafers.FindRunOfWaferAsync("W-LOOP-1", CancellationToken.None))!;
        Assert.Null((await evaluator.EvaluateAsync(first, chamber, CancellationToken.None)).Summary!.Diffusion);
        WaferReportOutcome unjudged = await reports.WriteAsync("W-LOOP-1", CancellationToken.None);
        Assert.Contains("No accepted diffusion radius model", Assert.Single(unjudged.Verdict.Rules, r => r.Rule == WaferEvaluator.RadiusModelRule).Reason, StringComparison.Ordinal);

        // Refit through the screen's command: a proposal with profile-likelihood intervals, not yet in force.
        await commands.RefitModelAsync(Process, "eng-1", CancellationToken.None);
        ModelFitRecord proposal = Assert.Single(await wafers.GetModelFitsAsync(Process, ModelKinds.Diffusion, 5, CancellationToken.None));
        Assert.Null(proposal.AcceptedAt);
        DiffusionRadiusModel fitted = ModelJson.Deserialize<DiffusionModelParams>(proposal.ParamsJson).Model;
        foreach (ParameterEstimate p in fitted.Parameters)
        {
            output.WriteLine($"{p.Name} = {p.Value:G4} [{p.Lower95:G4}, {p.Upper95:G4}] {p.Unit}");
        }
        Assert.Equal(["W-LOOP-1", "W-LOOP-2", "W-LOOP-3"], proposal.Wafers);
        ProcessModelView screen = (await queries.GetProcessModelAsync(Process, CancellationToken.None))!;
        Assert.NotNull(screen.Diffusion!.Proposed);
        Assert.Null(screen.Diffusion.Accepted);
        Assert.Contains(screen.Diffusion.Proposed!.Parameters, r => r.Name == "E_λ" && r.Lower95 < r.Value && r.Value < r.Upper95);
        Assert.Null((await evaluator.EvaluateAsync(first, chamber, CancellationToken.None)).Summary!.Diffusion); // a proposal is not used

        // A person accepts it (audited); the next run's run-end estimate now comes from it.
        await commands.AcceptModelAsync(Process, "eng-2", CancellationToken.None);
        // The next run: 600 °C for 1000 s with a +25 K, 3-minute excursion, and its wafer (outside the calibrated times).
        ThermalRecord nextRecord = GrowthTruth.Record(600, 1000, 4, excursionStartS: 400, excursionS: 180, excursionK: 25);
        var nextTruth = GrowthTruth.Wafer(nextRecord, GrowthTruth.Law, 104);
        RunRecord next = await GrowAsync(app, Process, "W-LOOP-NEXT", T0.AddHours(5), nextRecord, nextTruth);
        Assert.Contains(await queries.GetAuditAsync(50, CancellationToken.None), a => a.Action == "model accepted" && a.User == "eng-2" && a.Detail.Contains("diffusion model", StringComparison.Ordinal));
        RunDiffusionFigures runEnd = (await evaluator.EvaluateAsync(next, chamber, CancellationToken.None)).Summary!.Diffusion!;
        Assert.Null(runEnd.Error);
        Assert.Equal(proposal.Id, runEnd.ModelFitId);
        double truthMean = nextTruth.RadiiNm.Average();
        output.WriteLine($"run end: λ(setpoint) {runEnd.LambdaAtSetpointNm:F0} nm, λ_eff {runEnd.LambdaEffNm:F0} nm, expected mean {runEnd.MeanRadiusNm:F2} nm; truth mean {truthMean:F2} nm");
        Assert.Single(runEnd.Excursions);
        // Before SEM the estimate uses simulated sites at the process's density, not the wafer's own sites: 5 %.
        Assert.InRange(runEnd.MeanRadiusNm!.Value, truthMean * 0.95, truthMean * 1.05);

        // The next wafer's verdict uses the accepted diffusion model over the run's stored record and agrees with the truth.
        WaferReportOutcome judged = await reports.WriteAsync("W-LOOP-NEXT", CancellationToken.None);
        Assert.DoesNotContain(judged.Verdict.Rules, r => r.Rule == WaferEvaluator.RadiusModelRule);
        QcRuleResult bias = Assert.Single(judged.Verdict.Rules, r => r.Rule == "prediction-bias");
        WaferReportRecord json = (await wafers.GetReportsAsync("W-LOOP-NEXT", CancellationToken.None)).First(r => r.Format == "json");
        WaferReportDigest digest = WaferReportDigestJson.Read(json.SummaryJson!);
        Assert.Equal(proposal.Id, digest.Diffusion!.ModelFitId);
        double meanMeasured = digest.Statistics!.MeanRadiusNm;
        output.WriteLine($"wafer: bias {bias.Measured:F2} nm of {meanMeasured:F2} nm over {digest.Agreement!.Count} wires, RMSE {digest.Agreement.RmseNm:F2} nm; λ {digest.Diffusion.LambdaAtMeanNm:F0} nm, λ_eff {digest.Diffusion.LambdaEffNm:F0} nm");
        // Tolerance: mean bias within 3 % of the mean measured radius (the transfer test's criterion), per-wire RMSE within 8 %.
        Assert.InRange(bias.Measured!.Value / meanMeasured, -0.03, 0.03);
        Assert.True(digest.Agreement.RmseNm < 0.08 * meanMeasured, $"RMSE {digest.Agreement.RmseNm:F2} nm");
        Assert.True(digest.Agreement.Count >= 15);
        // λ_eff of the wafer lies between the truth's λ at the excursion's peak and at the setpoint (E_λ < 0: hotter is shorter).
        Assert.InRange(digest.Diffusion.LambdaEffNm!.Value, 1000 * GrowthTruth.Law.LambdaUm(PhysicalConstants.CelsiusToKelvin(625)) * 0.9,
            1000 * GrowthTruth.Law.LambdaUm(PhysicalConstants.CelsiusToKelvin(600)) * 1.1);
        // The wafer screen and the report show them.
        WaferDetail page = (await queries.GetWaferAsync("W-LOOP-NEXT", CancellationToken.None))!;
        Assert.Equal(digest.Diffusion.LambdaEffNm!.Value, page.Diffusion!.LambdaEffNm, 1e-9);
        Assert.Contains("λ_eff", await File.ReadAllTextAsync(judged.Files["html"]), StringComparison.Ordinal);
        await app.StopAsync();
    }

    [Fact]
    public async Task Refit_WafersAtOneTemperature_RefusedWithReasonStoredAndShown()
    {
        await using var app = await StartAsync();
        var wafers = app.Services.GetRequiredService<IWaferStore>();
        var commands = app.Services.GetRequiredService<IDashboardCommands>();
        var queries = app.Services.GetRequiredService<IDashboardQueries>();
        // Three wafers, all at 610 °C (different times): nothing in them separates E_λ from λ₀.
        double[] seconds = [1200, 1800, 2400];
        for (int k = 0; k < seconds.Length; k++)
        {
            ThermalRecord record = GrowthTruth.Record(610, seconds[k], 11 + k);
            await GrowAsync(app, FlatProcess, $"W-FLAT-{k + 1}", T0.AddHours(10 + k), record, GrowthTruth.Wafer(record, GrowthTruth.Law, 200 + k, 8, 6, 50));
        }

        var refused = await Assert.ThrowsAsync<InvalidOperationException>(() => commands.RefitModelAsync(FlatProcess, "eng-1", CancellationToken.None));

        Assert.Contains("one temperature", refused.Message, StringComparison.Ordinal);
        Assert.Empty(await wafers.GetModelFitsAsync(FlatProcess, ModelKinds.Diffusion, 5, CancellationToken.None));
        ModelFitRecord stored = Assert.Single(await wafers.GetModelFitsAsync(FlatProcess, ModelKinds.DiffusionRefusal, 5, CancellationToken.None));
        Assert.Null(stored.AcceptedAt);
        ProcessModelView screen = (await queries.GetProcessModelAsync(FlatProcess, CancellationToken.None))!;
        Assert.Contains("one temperature", screen.Diffusion!.Refusal, StringComparison.Ordinal);
        Assert.Null(screen.Diffusion.Proposed);
        // Nothing to accept.
        await Assert.ThrowsAsync<InvalidOperationException>(() => commands.AcceptModelAsync(FlatProcess, "eng-2", CancellationToken.None));
        await app.StopAsync();
    }
}
