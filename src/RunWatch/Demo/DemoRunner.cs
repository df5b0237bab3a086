using RunWatch.Ingest.Health;
using RunWatch.Simulation.Chamber;
using RunWatch.Simulation.Demo;
using RunWatch.Simulation.Growth;
using RunWatch.Storage;
using RunWatch.Wafers.Pipeline;

namespace RunWatch.Demo;

/// <summary>
/// Drives the demo against a running daemon: publishes each invented run over MQTT, waits for the run tracker to
/// close it with its thermal figures, then drops the wafer's SEM fields into the drop folder and waits for the
/// report. Prints where to look.
/// </summary>
internal sealed class DemoRunner(IRunWatchStore store, IWaferStore wafers, FieldIntakeService intake, IngestHealth health, int brokerPort, TimeProvider time, TextWriter output)
{
    public async Task<IReadOnlyList<WaferReportRecord>> RunAsync(CancellationToken cancellationToken)
    {
        var publisher = new ChamberPublisher("127.0.0.1", brokerPort, "runwatch", "lab", "demo-1");
        var reports = new List<WaferReportRecord>();
        await WaitForBrokerAsync(cancellationToken).ConfigureAwait(false);
        var cases = new DemoGrowthCases(Path.Combine(Path.GetDirectoryName(intake.DropFolder)!, "growth-cases"));
        foreach (DemoRunPlan plan in DemoSettings.Runs)
        {
            var simulation = new ChamberSimulatorOptions
            {
                Seed = plan.Seed,
                Acceleration = DemoSettings.Acceleration,
                Recipe = RecipeAt(plan.GrowthC, plan.GrowthS),
                ExcursionStep = plan.ExcursionHeatK > 0 ? "growth" : null,
                ExcursionHeatK = plan.ExcursionHeatK > 0 ? plan.ExcursionHeatK : 100,
            };
            // The wafers' truth is grown from the same simulated history the chamber publishes, while it plays.
            CaptureHistory history = GrowthHistory(simulation);
            (double FromS, double ToS) window = cases.WriteRecord(plan, simulation);
            var truth = new Dictionary<string, Task<TruthSummary>>(StringComparer.Ordinal);
            foreach (string wafer in plan.Wafers)
            {
                int seed = (plan.Seed * 10) + truth.Count; // stable across processes (string hashes are not)
                truth[wafer] = Task.Run(() => GrowFields(wafer, history, seed), cancellationToken);
            }
            output.WriteLine($"[demo] run {plan.Run}: growth at {plan.GrowthC:0} °C for {plan.GrowthS / 60:0} min{(plan.ExcursionHeatK > 0 ? " with an injected excursion" : "")}, wafers {string.Join(", ", plan.Wafers)}; publishing telemetry (demo clock accelerated {DemoSettings.Acceleration:0}x: the growth is recorded as {plan.GrowthS / DemoSettings.Acceleration:0} s) ...");
            int sent = await publisher.PublishRunAsync(plan, simulation, time, cancellationToken).ConfigureAwait(false);
            RunRecord run = await WaitForClosedRunAsync(plan.Run, cancellationToken).ConfigureAwait(false);
            output.WriteLine($"[demo] run {plan.Run} closed: {sent} samples; L_nom {Nm(run.LNomNm)}, L_eff {Nm(run.LEffNm)} (c = 1), T_eff {run.TEffC:0.0} °C, coverage {run.Coverage * 100:0.#} %");
            foreach (string wafer in plan.Wafers)
            {
                TruthSummary grown = await truth[wafer].ConfigureAwait(false);
                cases.AddWafer(wafer, plan.Run, window, grown.Images[0]);
                DropFields(wafer, grown);
            }
            foreach (string wafer in plan.Wafers)
            {
                var written = await WaitForReportAsync(wafer, cancellationToken).ConfigureAwait(false);
                reports.AddRange(written);
                WaferReportRecord first = written[0];
                output.WriteLine($"[demo] wafer {wafer}: verdict {first.Verdict.ToUpperInvariant()}");
                foreach (WaferReportRecord r in written.OrderBy(r => r.Format, StringComparer.Ordinal))
                {
                    output.WriteLine($"         {r.Format,-4} {r.FilePath}");
                }
            }
            await AcceptFirstModelAsync(cancellationToken).ConfigureAwait(false);
        }
        cases.WriteCaseFiles();
        output.WriteLine($"[demo] the runs on their own clock (not accelerated) with each wafer's first field, as growth cases for the diffusion model: "
            + $"runwatch model fit {Path.Combine(cases.Folder, DemoGrowthCases.CalibrateFile)} --out model.json, then runwatch model predict model.json {Path.Combine(cases.Folder, DemoGrowthCases.HoldOutFile)}");
        var calibration = await new ProcessCalibrationService(wafers, time).ProposeAsync("nw-demo", cancellationToken).ConfigureAwait(false);
        if (calibration is { } c)
        {
            output.WriteLine($"[demo] Arrhenius calibration proposed from {c.Fit.Count} wafers ({string.Join(", ", c.Fit.WaferIds)}): "
                + $"Ea = {c.Fit.ActivationEnergy.Value:0.###} eV, D0 = {c.Fit.Prefactor.Value:0.###e+0} cm²/s on the demo's accelerated clock "
                + $"(the demo chamber was configured with {DemoSettings.EaEv} eV and {DemoSettings.D0CmSqPerS * DemoSettings.Acceleration:0.###e+0} cm²/s); it waits for a person to accept it");
        }
        return reports;
    }

    /// <summary>The simulator's demo recipe with the growth steps moved to <paramref name="growthC"/> and the growth hold set to <paramref name="growthS"/>.</summary>
    private static IReadOnlyList<RecipeStep> RecipeAt(double growthC, double growthS)
    {
        var steps = new List<RecipeStep>();
        foreach (RecipeStep s in ChamberSimulatorOptions.DemoRecipe)
        {
            RecipeStep step = s.Name is "cool-to-growth" or "droplet-predeposition" or "stabilise" or "growth" ? s with { TargetC = growthC } : s;
            steps.Add(step.Name == "growth" ? step with { HoldS = growthS } : step);
        }
        return steps;
    }

    /// <summary>The growth step's thermocouple record (simulated seconds) as the truth's capture-length history.</summary>
    private static CaptureHistory GrowthHistory(ChamberSimulatorOptions simulation)
    {
        var times = new List<double>();
        var temperatures = new List<double>();
        foreach (ChamberSample sample in new ChamberSimulator(simulation).Run())
        {
            if (sample.Step == "growth" && sample.GaShutter == 1)
            {
                times.Add(sample.TimeS);
                temperatures.Add(sample.SubstrateTcC);
            }
        }
        return new CaptureHistory(times.ToArray(), temperatures.ToArray(), DemoSettings.Physics);
    }

    /// <summary>What the truth simulation made of one wafer, for the demo's output.</summary>
    private sealed record TruthSummary(IReadOnlyList<string> Images, double MeanLambdaUm, double PeakC, double MeanRadiusNm, double SdRadiusNm, int Wires, double DesorbedShare);

    /// <summary>Grows the wafer's fields from the adatom simulation and writes them into a staging folder of their own.</summary>
    private TruthSummary GrowFields(string wafer, CaptureHistory history, int seed)
    {
        string staging = Path.Combine(Path.GetDirectoryName(intake.DropFolder)!, "demo-staging", wafer);
        (IReadOnlyList<string> images, IReadOnlyList<GrownWires> truth) = DemoWaferFields.WriteGrown(staging, wafer, history, DemoSettings.Physics,
            DemoSettings.DensityPerUm2, DemoSettings.FieldsPerWafer, DemoSettings.LaunchedPerWire, seed);
        var radii = truth.SelectMany(t => t.RadiiNm).ToList();
        double mean = radii.Average();
        double sd = Math.Sqrt(radii.Sum(r => (r - mean) * (r - mean)) / Math.Max(radii.Count - 1, 1));
        double desorbed = truth.Sum(t => (double)t.Desorbed) / truth.Sum(t => (double)t.Launched);
        return new TruthSummary(images, history.MeanCaptureLengthUm(), history.PeakTemperatureC, mean, sd, radii.Count, desorbed);
    }

    /// <summary>Moves the staged fields, sidecar first and image last, into the drop folder.</summary>
    private void DropFields(string wafer, TruthSummary truth)
    {
        foreach (string image in truth.Images)
        {
            string name = Path.GetFileName(image);
            string sidecar = image + Imaging.Scale.FieldSidecar.Suffix;
            File.Move(sidecar, Path.Combine(intake.DropFolder, name + Imaging.Scale.FieldSidecar.Suffix), overwrite: true);
            File.Move(image, Path.Combine(intake.DropFolder, name), overwrite: true);
        }
        output.WriteLine($"[demo] wafer {wafer}: {DemoSettings.FieldsPerWafer} SEM fields (invented) dropped into {intake.DropFolder}; their truth, from an adatom simulation "
            + $"over the run's thermal record (peak {truth.PeakC:0.0} °C): mean λ {truth.MeanLambdaUm * 1000:0} nm, {truth.Wires} simulated wires (image and margin) of {truth.MeanRadiusNm:0.0} ± {truth.SdRadiusNm:0.0} nm, {truth.DesorbedShare * 100:0} % of the adatoms desorbed");
    }

    /// <summary>
    /// The first wafer's report proposes a radius model; process models are never used until a person accepts
    /// them. The demo accepts it on behalf of its demo user so that later wafers are judged against it.
    /// </summary>
    private async Task AcceptFirstModelAsync(CancellationToken cancellationToken)
    {
        var fits = await wafers.GetModelFitsAsync("nw-demo", ModelKinds.Radius, 20, cancellationToken).ConfigureAwait(false);
        if (fits.Count == 0 || fits.Any(f => f.AcceptedAt is not null))
        {
            return;
        }
        ModelFitRecord proposed = fits[^1];
        await wafers.AcceptModelFitAsync(proposed.Id, DemoUser, cancellationToken).ConfigureAwait(false);
        await store.AppendAuditAsync(new AuditEntry(time.GetUtcNow(), DemoUser, "model accepted", $"radius model {proposed.Id} of nw-demo (demo: accepted automatically)", null), cancellationToken).ConfigureAwait(false);
        output.WriteLine($"[demo] radius model of process nw-demo fitted on {string.Join(", ", proposed.Wafers)} accepted by '{DemoUser}' (the demo does this itself; in use an engineer reviews and accepts it)");
    }

    private const string DemoUser = "demo-engineer";

    /// <summary>The daemon subscribes once connected; a run-start published before that would reach nobody.</summary>
    private async Task WaitForBrokerAsync(CancellationToken cancellationToken)
    {
        DateTimeOffset deadline = time.GetUtcNow().AddSeconds(30);
        while (health.Snapshot().BrokerState != BrokerConnectionState.Connected)
        {
            if (time.GetUtcNow() > deadline)
            {
                throw new TimeoutException("the daemon did not connect to the embedded broker within 30 s");
            }
            await Task.Delay(TimeSpan.FromMilliseconds(100), time, cancellationToken).ConfigureAwait(false);
        }
        await Task.Delay(TimeSpan.FromMilliseconds(300), time, cancellationToken).ConfigureAwait(false);
    }

    private async Task<RunRecord> WaitForClosedRunAsync(string name, CancellationToken cancellationToken)
    {
        DateTimeOffset deadline = time.GetUtcNow().AddMinutes(3);
        while (time.GetUtcNow() < deadline)
        {
            foreach (RunRecord run in await store.ListRunsAsync("demo-1", null, 20, cancellationToken).ConfigureAwait(false))
            {
                if (run.Name == name && run.Status == RunStatus.Closed && run.LEffNm is not null)
                {
                    return run;
                }
            }
            await Task.Delay(TimeSpan.FromMilliseconds(250), time, cancellationToken).ConfigureAwait(false);
        }
        throw new TimeoutException($"run {name} was not closed with its thermal figures within 3 minutes");
    }

    private async Task<IReadOnlyList<WaferReportRecord>> WaitForReportAsync(string wafer, CancellationToken cancellationToken)
    {
        DateTimeOffset deadline = time.GetUtcNow().AddMinutes(5);
        while (time.GetUtcNow() < deadline)
        {
            var reports = await wafers.GetReportsAsync(wafer, cancellationToken).ConfigureAwait(false);
            var fields = await wafers.GetFieldsOfWaferAsync(wafer, cancellationToken).ConfigureAwait(false);
            if (reports.Count >= 4 && fields.Count >= DemoSettings.FieldsPerWafer && fields.All(f => f.Status != FieldStatus.Queued && f.Status != FieldStatus.Unassigned)
                && reports.All(r => r.CreatedAt >= fields.Max(f => f.ImportedAt)))
            {
                return reports;
            }
            await Task.Delay(TimeSpan.FromMilliseconds(250), time, cancellationToken).ConfigureAwait(false);
        }
        throw new TimeoutException($"wafer {wafer} got no report within 5 minutes");
    }

    private static string Nm(double? nm) => nm is { } v ? $"{v / 1000:0.###} µm" : "—";
}
