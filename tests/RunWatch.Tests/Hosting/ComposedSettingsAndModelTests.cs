using System.Globalization;
using System.Net;
using System.Net.Http.Json;
using System.Text.RegularExpressions;
using System.Text.Json;
using MathNet.Numerics;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using RunWatch.Core.Model;
using RunWatch.Core.Safety;
using RunWatch.Core.Wafers;
using RunWatch.Hosting;
using RunWatch.Storage;
using RunWatch.Testing.Mqtt;
using RunWatch.Wafers.Pipeline;
using RunWatch.Web.Data;
using RunWatch.Web.Safety;
using RunWatch.Web.Security;
using Xunit;
using CoreArrheniusFit = RunWatch.Core.Model.ArrheniusFit;
using CoreArrheniusPoint = RunWatch.Core.Model.ArrheniusPoint;

namespace RunWatch.Tests.Hosting;

/// <summary>
/// The whole program as <c>runwatch serve</c> composes it, on a real SQLite file: refit from the Process model screen,
/// acceptance, the planner on the accepted model, spec and reminder edits, and all of it again after a restart.
/// </summary>
public sealed class ComposedSettingsAndModelTests : IDisposable
{
    private const double BoltzmannEvPerK = 1.380649e-23 / 1.602176634e-19; // CONFIRMED (CHECKS.md §1): exact SI constants
    private const string Process = "nw-inv";
    private const string Password = "an-invented-test-password";
    private readonly string _folder = Directory.CreateTempSubdirectory("runwatch-composed-").FullName;
    private string _baseUrl = "";

    public void Dispose()
    {
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
        Directory.Delete(_folder, recursive: true);
    }

    private async Task<WebApplication> StartAsync(double ventThresholdC)
    {
        int port = FreePort.Next();
        var settings = new Dictionary<string, string?>
        {
            ["Urls"] = _baseUrl = "http://127.0.0.1:" + FreePort.Next().ToString(CultureInfo.InvariantCulture),
            ["ChambersFile"] = Path.Combine(_folder, "none.json"),
            ["Storage:DataDirectory"] = _folder,
            ["Broker:Mode"] = "Embedded",
            ["Broker:Host"] = "127.0.0.1",
            ["Broker:Port"] = port.ToString(CultureInfo.InvariantCulture),
            ["Chambers:0:Name"] = "c1",
            ["Chambers:0:Site"] = "invented lab",
            ["Chambers:0:Channels:0:Name"] = "substrate_tc",
            ["Chambers:0:Channels:0:Role"] = "GrowthTemperature",
            ["Chambers:0:Channels:0:Unit"] = "degC",
            ["Qc:Recipes:nw-inv:TargetMeanRadiusNm"] = "45",
            ["Qc:Recipes:nw-inv:MeanRadiusToleranceNm"] = "10",
            ["Qc:Recipes:nw-inv:MinWireCount"] = "50",
            ["RunWatch:Dashboard:ReminderThresholds:substrate-above-vent-limit"] = ventThresholdC.ToString(CultureInfo.InvariantCulture),
        };
        var builder = WebApplication.CreateBuilder(new WebApplicationOptions { EnvironmentName = Environments.Development, ApplicationName = "runwatch" });
        builder.Configuration.AddInMemoryCollection(settings);
        builder.WebHost.UseStaticWebAssets();
        builder.AddRunWatch([]);
        var app = builder.Build();
        var users = app.Services.GetRequiredService<UserDirectory>();
        users.AddWithPassword("ada-admin", DashboardRoles.Admin, Password);
        users.AddWithPassword("eng-1", DashboardRoles.Engineer, Password);
        users.AddWithPassword("vic-viewer", DashboardRoles.Viewer, Password);
        app.MapRunWatch();
        await app.StartAsync();
        return app;
    }

    private static async Task SeedWafersAsync(IWaferStore store, List<CoreArrheniusPoint> points, List<FieldWire> wires)
    {
        // Invented process: L from Ea 1.3 eV, D0 5e-4 cm²/s, c = 1, t = 1500 s, scattered ±4 %; wires r = 18 + 26·Â.
        var random = new Random(11);
        double[] temperaturesK = [858.15, 873.15, 888.15];
        for (int i = 0; i < temperaturesK.Length; i++)
        {
            string wafer = "W-INV-" + i.ToString(CultureInfo.InvariantCulture);
            double d = 5e-4 * Math.Exp(-1.3 / (BoltzmannEvPerK * temperaturesK[i]));
            var point = new CoreArrheniusPoint(wafer, Math.Sqrt(d * 1500) * 1e7 * (1 + (0.04 * ((2 * random.NextDouble()) - 1))), 1500, temperaturesK[i], 1);
            var fieldWires = new List<FieldWire>();
            for (int k = 0; k < 60; k++)
            {
                double a = 0.25 + (1.5 * random.NextDouble());
                fieldWires.Add(new FieldWire(k, 300 * k, 300 * k, 18 + (26 * a) + (3 * (random.NextDouble() - 0.5)), true, true, a));
            }
            points.Add(point);
            wires.AddRange(fieldWires);
            await store.UpsertWaferAsync(wafer, null, Process, CancellationToken.None);
            var (field, _) = await store.AddFieldAsync(new FieldRecord
            {
                Wafer = wafer, FilePath = "fields/" + wafer + ".png", RelativePath = wafer + ".png", Sha256 = "sha-" + wafer, Status = FieldStatus.Analysed,
            }, CancellationToken.None);
            var result = new FieldResult { FieldName = wafer, PixelSizeNm = 5, WidthNm = 20_000, AnalysedHeightNm = 20_000, Threshold = "otsu", AnalysedAreaCm2 = 4e-6, Wires = fieldWires };
            await store.SaveAnalysisAsync(new AnalysisRecord { FieldId = field.Id, Status = "done", ResultsJson = FieldResultJson.Write(result) }, CancellationToken.None);
            await store.SaveModelFitAsync(new ModelFitRecord { Process = Process, Model = ModelKinds.CaptureRadius, ParamsJson = ModelJson.Serialize(point), Wafers = [wafer] },
                CancellationToken.None);
        }
    }

    [Fact]
    public async Task RefitAcceptPlanAndEdit_OverComposedHost_ProposedFitsAgreeAndEverythingSurvivesRestart()
    {
        var points = new List<CoreArrheniusPoint>();
        var wires = new List<FieldWire>();
        PlannerResult planned;
        await using (var app = await StartAsync(ventThresholdC: 180))
        {
            var wafers = app.Services.GetRequiredService<IWaferStore>();
            var commands = app.Services.GetRequiredService<IDashboardCommands>();
            var queries = app.Services.GetRequiredService<IDashboardQueries>();
            await SeedWafersAsync(wafers, points, wires);

            await commands.RefitModelAsync(Process, "eng-1", CancellationToken.None);
            var proposedRadius = (await wafers.GetModelFitsAsync(Process, ModelKinds.Radius, 5, CancellationToken.None)).Single();
            var proposedArrhenius = (await wafers.GetModelFitsAsync(Process, ModelKinds.Arrhenius, 5, CancellationToken.None)).Single();
            Assert.Null(proposedRadius.AcceptedAt);
            Assert.Null(proposedArrhenius.AcceptedAt);

            // The same computation called directly gives the same fits.
            ProcessRefit direct = await new ProcessCalibrationService(wafers, TimeProvider.System).RefitAsync(Process, CancellationToken.None);
            var viaScreen = ModelJson.Deserialize<RadiusModelFit>(proposedRadius.ParamsJson);
            var arrhenius = ModelJson.Deserialize<CoreArrheniusFit>(proposedArrhenius.ParamsJson);
            Assert.Equal(direct.Radius!.Kind, viaScreen.Kind);
            Assert.Equal(direct.Radius.Parameters[0].Value, viaScreen.Parameters[0].Value, 1e-9);
            Assert.Equal(direct.Radius.Parameters[1].Value, viaScreen.Parameters[1].Value, 1e-9);
            Assert.Equal(direct.Arrhenius!.ActivationEnergy.Value, arrhenius.ActivationEnergy.Value, 1e-12);
            Assert.Equal(direct.Arrhenius.Prefactor.Value, arrhenius.Prefactor.Value, direct.Arrhenius.Prefactor.Value * 1e-12);
            // Independent reference: MathNet.Numerics Fit.Line on (1/(kB·T), ln(L²/(c·t))) gives (ln D0, −Ea) (CONFIRMED: Fit.Line returns (intercept, slope)).
            var (intercept, slope) = Fit.Line(points.Select(p => 1 / (BoltzmannEvPerK * p.EffectiveTemperatureK)).ToArray(),
                points.Select(p => Math.Log(Math.Pow(p.CaptureRadiusNm * 1e-7, 2) / (p.ConventionFactor * p.GrowthDurationS))).ToArray());
            Assert.Equal(-slope, arrhenius.ActivationEnergy.Value, 1e-9);
            Assert.Equal(Math.Exp(intercept), arrhenius.Prefactor.Value, Math.Exp(intercept) * 1e-9);
            var refitAudit = (await queries.GetAuditAsync(50, CancellationToken.None)).Single(a => a.Action == "model refitted");
            Assert.Equal("eng-1", refitAudit.User);
            Assert.Contains("Arrhenius Ea", refitAudit.Detail, StringComparison.Ordinal);

            // Accept; the planner now uses that model (the direct call above made a second, newer proposal: accept it, it is identical).
            await commands.AcceptModelAsync(Process, "eng-2", CancellationToken.None);
            planned = await app.Services.GetRequiredService<IPlannerEngine>().PredictAsync(
                new PlannerInput(Process, [new ProfilePoint(0, 600), new ProfilePoint(25, 600)], TimeSpan.FromMinutes(25), 1.0), CancellationToken.None);
            double handLNm = Math.Sqrt(arrhenius.Prefactor.Value * Math.Exp(-arrhenius.ActivationEnergy.Value / (BoltzmannEvPerK * 873.15)) * 1500) * 1e7; // DERIVED, c = 1
            Assert.Equal(handLNm, planned.LEffNm, handLNm * 1e-9);
            Assert.Equal("eng-2", planned.Model!.RadiusAcceptedBy);
            Assert.Equal("eng-2", planned.Model.DiffusivityAcceptedBy);

            // An admin's spec edit and reminder edit.
            SpecEntry mean = (await queries.GetSpecsAsync(CancellationToken.None)).Single(s => s.Recipe == Process && s.Name == "mean radius");
            await commands.UpdateSpecAsync(mean with { Min = 20, Max = 30 }, "ada-admin", CancellationToken.None);
            await app.Services.GetRequiredService<ReminderRuleEditor>().UpdateThresholdAsync("run-ended-still-hot", 80, "ada-admin", CancellationToken.None);
            await app.StopAsync();
        }

        // Configuration changed meanwhile: the stored values stay in force; configuration only seeds.
        await using (var restarted = await StartAsync(ventThresholdC: 170))
        {
            var queries = restarted.Services.GetRequiredService<IDashboardQueries>();
            SpecEntry mean = (await queries.GetSpecsAsync(CancellationToken.None)).Single(s => s.Recipe == Process && s.Name == "mean radius");
            Assert.Equal((20.0, 30.0), (mean.Min!.Value, mean.Max!.Value));
            Assert.Equal(25, (await restarted.Services.GetRequiredService<QcSpecificationCatalog>().SpecificationForAsync(Process, CancellationToken.None)).TargetMeanRadiusNm);
            ReminderRule rule = restarted.Services.GetRequiredService<ReminderRuleSet>().Rules.Single(r => r.Id == "run-ended-still-hot");
            Assert.Equal(80, rule.Threshold);
            Assert.Equal(180, restarted.Services.GetRequiredService<ReminderRuleSet>().Rules.Single(r => r.Id == "substrate-above-vent-limit").Threshold);
            ProcessModelView model = (await queries.GetProcessModelAsync(Process, CancellationToken.None))!;
            Assert.Equal("eng-2", model.AcceptedBy);
            Assert.Equal(wires.Count, model.RadiusData.Count); // every seeded wire is vertical and interior
            PlannerResult again = await restarted.Services.GetRequiredService<IPlannerEngine>().PredictAsync(
                new PlannerInput(Process, [new ProfilePoint(0, 600), new ProfilePoint(25, 600)], TimeSpan.FromMinutes(25), 1.0), CancellationToken.None);
            Assert.Equal(planned.LEffNm, again.LEffNm);
            Assert.Equal(planned.RadiiNm, again.RadiiNm);
            var audit = await queries.GetAuditAsync(100, CancellationToken.None);
            Assert.Contains(audit, a => a.Action == "spec edited" && a.User == "ada-admin");
            Assert.Contains(audit, a => a.Action == "reminder edited" && a.User == "ada-admin" && a.Detail == "threshold 100 → 80 °C");
            Assert.Contains(audit, a => a.Action == "model accepted" && a.User == "eng-2");
            await restarted.StopAsync();
        }
    }

    /// <summary>Logs in through the login form (antiforgery token included), as a lab system would, and keeps the cookie.</summary>
    private async Task<HttpClient> LoginAsync(string user)
    {
        var client = new HttpClient(new HttpClientHandler { CookieContainer = new CookieContainer(), AllowAutoRedirect = false }) { BaseAddress = new Uri(_baseUrl) };
        // A client that is not a browser names the dashboard as its origin for state-changing requests (docs/security.md).
        client.DefaultRequestHeaders.Add("Origin", _baseUrl);
        string page = await client.GetStringAsync("/login");
        string input = Regex.Match(page, "<input[^>]*__RequestVerificationToken[^>]*>").Value;
        string token = WebUtility.HtmlDecode(Regex.Match(input, "value=\"([^\"]+)\"").Groups[1].Value);
        using var response = await client.PostAsync("/account/login", new FormUrlEncodedContent(new Dictionary<string, string>
        {
            ["username"] = user, ["password"] = Password, ["__RequestVerificationToken"] = token,
        }));
        Assert.Equal(HttpStatusCode.Redirect, response.StatusCode);
        Assert.Equal("/", response.Headers.Location?.OriginalString);
        return client;
    }

    [Fact]
    public async Task Api_SpecEditAndRefit_RolesEnforcedAndInvalidEditRefused()
    {
        await using var app = await StartAsync(ventThresholdC: 200);
        using var admin = await LoginAsync("ada-admin");
        using var engineer = await LoginAsync("eng-1");
        using var viewer = await LoginAsync("vic-viewer");
        var valid = new { recipe = Process, name = "mean radius", min = 30.0, max = 40.0, unit = "nm" };

        using var byViewer = await viewer.PostAsJsonAsync("/api/specs", valid);
        using var byEngineer = await engineer.PostAsJsonAsync("/api/specs", valid);
        using var invalid = await admin.PostAsJsonAsync("/api/specs", new { recipe = Process, name = "mean radius", min = 40.0, max = 30.0, unit = "nm" });
        using var wrongUnit = await admin.PostAsJsonAsync("/api/specs", new { recipe = Process, name = "mean radius", min = 30.0, max = 40.0, unit = "µm" });
        var specBeforeValid = await app.Services.GetRequiredService<QcSpecificationCatalog>().SpecificationForAsync(Process, CancellationToken.None);
        using var byAdmin = await admin.PostAsJsonAsync("/api/specs", valid);
        using var refitByViewer = await viewer.PostAsync($"/api/models/{Process}/refit", null);
        using var refitByEngineer = await engineer.PostAsync($"/api/models/{Process}/refit", null);
        string audit = await admin.GetStringAsync("/api/audit");

        Assert.Equal(HttpStatusCode.Forbidden, byViewer.StatusCode);
        Assert.Equal(HttpStatusCode.Forbidden, byEngineer.StatusCode);
        Assert.Equal(HttpStatusCode.BadRequest, invalid.StatusCode);
        Assert.Contains("must be below the upper", await invalid.Content.ReadAsStringAsync(), StringComparison.Ordinal);
        Assert.Equal(HttpStatusCode.BadRequest, wrongUnit.StatusCode);
        Assert.Equal((45.0, 10.0), (specBeforeValid.TargetMeanRadiusNm!.Value, specBeforeValid.MeanRadiusToleranceNm!.Value)); // refused edits changed nothing
        Assert.Equal(HttpStatusCode.NoContent, byAdmin.StatusCode);
        var spec = await app.Services.GetRequiredService<QcSpecificationCatalog>().SpecificationForAsync(Process, CancellationToken.None);
        Assert.Equal((35.0, 5.0), (spec.TargetMeanRadiusNm!.Value, spec.MeanRadiusToleranceNm!.Value));
        Assert.Equal(HttpStatusCode.Forbidden, refitByViewer.StatusCode);
        // No wafers stored: the refit is refused with the reason (409), and nothing is proposed.
        Assert.Equal(HttpStatusCode.Conflict, refitByEngineer.StatusCode);
        Assert.Contains("Nothing to refit", await refitByEngineer.Content.ReadAsStringAsync(), StringComparison.Ordinal);
        Assert.Contains("ada-admin", audit, StringComparison.Ordinal);
        Assert.Contains("spec edited", audit, StringComparison.Ordinal);
        await app.StopAsync();
    }
}
