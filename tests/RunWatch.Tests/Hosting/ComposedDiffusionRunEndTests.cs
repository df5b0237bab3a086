using System.Globalization;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using RunWatch.Core.Model;
using RunWatch.Core.Model.Diffusion;
using RunWatch.Hosting;
using RunWatch.Ingest.Chambers;
using RunWatch.Ingest.Runs;
using RunWatch.Storage;
using RunWatch.Testing.Mqtt;
using RunWatch.Web.Data;
using Xunit;

namespace RunWatch.Tests.Hosting;

/// <summary>
/// The loop from an accepted diffusion model to the daemon's run-end evaluation, in the program as
/// <c>runwatch serve</c> composes it on a real SQLite file: a proposal changes nothing, accepting it gives the next
/// evaluation of a run λ at the setpoint, λ_eff and the expected radius from that model, and accepting another model
/// changes them again.
/// </summary>
public sealed class ComposedDiffusionRunEndTests : IDisposable
{
    private const double BoltzmannEvPerK = 1.380649e-23 / 1.602176634e-19; // CONFIRMED (CHECKS.md §1): exact SI constants
    private const string Process = "nw-inv-diffusion";
    private const double SetpointC = 600;
    private const double GrowthS = 1800;
    private const double Kappa = 0.9; // nm² per µm²·s, invented
    private static readonly DateTimeOffset T0 = new(2026, 3, 2, 8, 0, 0, TimeSpan.Zero);
    private readonly string _folder = Directory.CreateTempSubdirectory("runwatch-composed-diffusion-").FullName;

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

    /// <summary>A model whose λ at <paramref name="temperatureK"/> is <paramref name="lambdaUm"/> (E_λ invented, 0.4 eV).</summary>
    private static DiffusionModelParams Model(double lambdaUm, double temperatureK) =>
        new(new DiffusionRadiusModel(lambdaUm * lambdaUm * Math.Exp(0.4 / (BoltzmannEvPerK * temperatureK)), 0.4, Kappa, 0, temperatureK, [], 580, 620, 1200, 2400, 2),
            WireDensityPerUm2: 1.0);

    [Fact]
    public async Task AcceptedDiffusionModel_OverComposedHost_ChangesTheNextRunEndEvaluation()
    {
        await using var app = await StartAsync();
        var store = app.Services.GetRequiredService<IRunWatchStore>();
        var wafers = app.Services.GetRequiredService<IWaferStore>();
        var evaluator = app.Services.GetRequiredService<RunEvaluator>();
        ChamberRuntime chamber = app.Services.GetRequiredService<ChamberRegistryHolder>().Registry.All.Single(c => c.Name == "c1");

        // An isothermal invented run: 600 °C for 30 minutes, one reading a second.
        var batch = new IngestBatch();
        for (int t = 0; t <= GrowthS; t++)
        {
            batch.AddSample(new SampleRow(chamber.ChamberId, chamber.GrowthTemperature!.ChannelId, UnixMicros.From(T0.AddSeconds(t)), t, SetpointC));
        }
        await store.WriteBatchAsync(batch, CancellationToken.None);
        var run = new RunRecord
        {
            Chamber = "c1", Name = "R-DIFF", Recipe = Process, Status = RunStatus.Closed, StartedAt = T0, EndedAt = T0.AddSeconds(GrowthS),
            SetpointC = SetpointC, PlannedSeconds = GrowthS,
        };

        // No accepted model: the thermal figures only, no diffusion figures.
        RunRecord before = await evaluator.EvaluateAsync(run, chamber, CancellationToken.None);
        Assert.NotNull(before.LEffNm);
        Assert.Null(before.Summary!.Diffusion);

        // A proposal is not used until a person accepts it.
        double setpointK = SetpointC + 273.15;
        ModelFitRecord wide = await wafers.SaveModelFitAsync(new ModelFitRecord
        {
            Process = Process, Model = ModelKinds.Diffusion, ParamsJson = ModelJson.Serialize(Model(20, setpointK)), Wafers = ["W-A", "W-B", "W-C"],
        }, CancellationToken.None);
        Assert.Null((await evaluator.EvaluateAsync(run, chamber, CancellationToken.None)).Summary!.Diffusion);

        await wafers.AcceptModelFitAsync(wide.Id, "eng-1", CancellationToken.None);
        RunDiffusionFigures accepted = (await evaluator.EvaluateAsync(run, chamber, CancellationToken.None)).Summary!.Diffusion!;
        Assert.Null(accepted.Error);
        Assert.Equal(wide.Id, accepted.ModelFitId);
        // Closed form: λ(T)² = λ₀²·exp(−E/(k_B·T)) at the setpoint; at constant temperature λ_eff is λ itself (its definition).
        double lambdaSetNm = 1000 * Math.Sqrt(Model(20, setpointK).Model.Lambda0SquaredUm2 * Math.Exp(-0.4 / (BoltzmannEvPerK * setpointK)));
        Assert.Equal(lambdaSetNm, accepted.LambdaAtSetpointNm!.Value, lambdaSetNm * 1e-9);
        Assert.Equal(lambdaSetNm, accepted.LambdaEffNm!.Value, lambdaSetNm * 0.01);
        Assert.False(accepted.Extrapolated);
        Assert.Empty(accepted.Excursions);
        // Mass balance (DERIVED): with λ = 20 µm ≫ the ~1 µm spacing, desorption before capture is ~0.1 % of the flux
        // (cell area / (2π λ²) · (ln(ℓ/R) − 3/4)), so the wires share all of it: mean A = 1/density and
        // mean r² = κ·t/density (r₀ = 0). mean r² = mean² + SD²·(n−1)/n; n is not reported, (n−1)/n ≥ 0.99 here.
        double meanSquare = (accepted.MeanRadiusNm!.Value * accepted.MeanRadiusNm.Value) + (accepted.RadiusSdNm!.Value * accepted.RadiusSdNm.Value);
        double expected = Kappa * GrowthS / 1.0;
        Assert.Equal(expected, meanSquare, expected * 0.012);

        // Accepting a desorption-limited model (λ = 0.25 µm at the setpoint) changes the next evaluation: wires now lose
        // adatoms to desorption, so they collect less than the whole flux.
        ModelFitRecord narrow = await wafers.SaveModelFitAsync(new ModelFitRecord
        {
            Process = Process, Model = ModelKinds.Diffusion, ParamsJson = ModelJson.Serialize(Model(0.25, setpointK)), Wafers = ["W-D", "W-E", "W-F"],
        }, CancellationToken.None);
        await wafers.AcceptModelFitAsync(narrow.Id, "eng-1", CancellationToken.None);
        RunRecord after = await evaluator.EvaluateAsync(run, chamber, CancellationToken.None);
        RunDiffusionFigures second = after.Summary!.Diffusion!;
        Assert.Equal(narrow.Id, second.ModelFitId);
        Assert.Equal(250, second.LambdaAtSetpointNm!.Value, 1e-6);
        Assert.True(second.MeanRadiusNm < accepted.MeanRadiusNm * 0.95, $"{second.MeanRadiusNm} against {accepted.MeanRadiusNm}");
        // The thermal figures do not depend on the radius model.
        Assert.Equal(before.LEffNm!.Value, after.LEffNm!.Value, 1e-9);

        // The figures survive the store (typed summary JSON).
        RunRecord saved = await store.SaveRunAsync(after, CancellationToken.None);
        RunDiffusionFigures reread = (await store.GetRunAsync(saved.Id, CancellationToken.None))!.Summary!.Diffusion!;
        Assert.Equal(second.MeanRadiusNm, reread.MeanRadiusNm);
        Assert.Equal(second.LambdaEffNm, reread.LambdaEffNm);
        // The run screen's query hands them to the page.
        RunDetail detail = (await app.Services.GetRequiredService<IDashboardQueries>().GetRunAsync("R-DIFF", CancellationToken.None))!;
        Assert.Equal(second.LambdaAtSetpointNm, detail.Diffusion!.LambdaAtSetpointNm);
    }
}
