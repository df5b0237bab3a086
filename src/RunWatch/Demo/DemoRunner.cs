using RunWatch.Ingest.Health;
using RunWatch.Simulation.Chamber;
using RunWatch.Simulation.Demo;
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
        foreach (DemoRunPlan plan in DemoSettings.Runs)
        {
            var simulation = new ChamberSimulatorOptions
            {
                Seed = plan.Seed,
                Acceleration = DemoSettings.Acceleration,
                Recipe = RecipeAt(plan.GrowthC),
            };
            output.WriteLine($"[demo] run {plan.Run}: growth at {plan.GrowthC:0} °C, wafers {string.Join(", ", plan.Wafers)}; publishing telemetry ({DemoSettings.Acceleration:0}x accelerated) ...");
            int sent = await publisher.PublishRunAsync(plan, simulation, time, cancellationToken).ConfigureAwait(false);
            RunRecord run = await WaitForClosedRunAsync(plan.Run, cancellationToken).ConfigureAwait(false);
            output.WriteLine($"[demo] run {plan.Run} closed: {sent} samples; L_nom {Nm(run.LNomNm)}, L_eff {Nm(run.LEffNm)} (c = 1), T_eff {run.TEffC:0.0} °C, coverage {run.Coverage * 100:0.#} %");
            foreach (string wafer in plan.Wafers)
            {
                DropFields(wafer, run.LEffNm ?? 300, plan.Seed + wafer.GetHashCode(StringComparison.Ordinal) % 1000);
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
        var calibration = await new ProcessCalibrationService(wafers, time).ProposeAsync("nw-demo", cancellationToken).ConfigureAwait(false);
        if (calibration is { } c)
        {
            output.WriteLine($"[demo] Arrhenius calibration proposed from {c.Fit.Count} wafers ({string.Join(", ", c.Fit.WaferIds)}): "
                + $"Ea = {c.Fit.ActivationEnergy.Value:0.###} eV, D0 = {c.Fit.Prefactor.Value:0.###e+0} cm²/s on the demo's accelerated clock "
                + $"(the demo chamber was configured with {DemoSettings.EaEv} eV and {DemoSettings.D0CmSqPerS * DemoSettings.Acceleration:0.###e+0} cm²/s); it waits for a person to accept it");
        }
        return reports;
    }

    /// <summary>The simulator's demo recipe with the growth steps moved to <paramref name="growthC"/>.</summary>
    private static IReadOnlyList<RecipeStep> RecipeAt(double growthC)
    {
        var steps = new List<RecipeStep>();
        foreach (RecipeStep s in ChamberSimulatorOptions.DemoRecipe)
        {
            steps.Add(s.Name is "cool-to-growth" or "droplet-predeposition" or "stabilise" or "growth" ? s with { TargetC = growthC } : s);
        }
        return steps;
    }

    /// <summary>Writes the fields in a staging folder, then moves sidecar first and image last into the drop folder.</summary>
    private void DropFields(string wafer, double lEffNm, int seed)
    {
        string staging = Path.Combine(Path.GetDirectoryName(intake.DropFolder)!, "demo-staging");
        foreach (string image in DemoWaferFields.Write(staging, wafer, lEffNm, DemoSettings.DensityPerCm2, DemoSettings.FieldsPerWafer, Math.Abs(seed)))
        {
            string name = Path.GetFileName(image);
            string sidecar = image + Imaging.Scale.FieldSidecar.Suffix;
            File.Move(sidecar, Path.Combine(intake.DropFolder, name + Imaging.Scale.FieldSidecar.Suffix), overwrite: true);
            File.Move(image, Path.Combine(intake.DropFolder, name), overwrite: true);
        }
        output.WriteLine($"[demo] wafer {wafer}: {DemoSettings.FieldsPerWafer} SEM fields (invented) dropped into {intake.DropFolder}");
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
