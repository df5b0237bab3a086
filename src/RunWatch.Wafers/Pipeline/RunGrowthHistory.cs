using RunWatch.Core.Model.Diffusion;
using RunWatch.Core.Thermal;
using RunWatch.Storage;

namespace RunWatch.Wafers.Pipeline;

/// <summary>
/// A run's real growth history as the diffusion model needs it: the stored substrate record (the chamber's
/// growth-temperature channel, mapped to true temperatures by that channel's calibration points) over the growth
/// window the run tracker recorded, reduced to time at each temperature (<see cref="ThermalExposure"/>).
/// </summary>
internal sealed class RunGrowthHistory(IRunWatchStore store)
{
    private const int MaxSamples = 5_000_000;

    /// <summary>The exposure of <paramref name="run"/>, or null with the reason in words.</summary>
    public async Task<(ThermalExposure? Exposure, string? Missing)> LoadAsync(RunRecord? run, CancellationToken cancellationToken)
    {
        if (run is null)
        {
            return (null, "the wafer is linked to no run");
        }
        ChannelDefinition? channel = null;
        foreach (RegisteredChamber c in await store.ListChambersAsync(cancellationToken).ConfigureAwait(false))
        {
            if (c.Definition.Name != run.Chamber)
            {
                continue;
            }
            foreach (RegisteredChannel ch in c.Channels)
            {
                if (ch.Definition.Role == ChannelRole.GrowthTemperature)
                {
                    channel = ch.Definition;
                }
            }
        }
        if (channel is null)
        {
            return (null, $"chamber {run.Chamber} of run {run.Name} has no growth-temperature channel");
        }
        DateTimeOffset end = run.EndedAt ?? run.LastSampleAt ?? run.StartedAt;
        IReadOnlyList<SampleRecord> samples = await store.GetSamplesAsync(run.Chamber, channel.Name, run.StartedAt, end.AddTicks(10), MaxSamples, cancellationToken)
            .ConfigureAwait(false);
        if (samples.Count < 2)
        {
            return (null, $"run {run.Name} has {samples.Count} stored temperature sample(s)");
        }
        var times = new double[samples.Count];
        var values = new double[samples.Count];
        for (int i = 0; i < samples.Count; i++)
        {
            times[i] = (samples[i].Timestamp - run.StartedAt).Ticks / (double)TimeSpan.TicksPerSecond;
            values[i] = samples[i].Value;
        }
        var record = new ThermalRecord(channel.Name, times, values, run.StartedAt);
        var calibration = new TemperatureCalibration(channel.Calibration.Select(p => new Core.Thermal.CalibrationPoint(p.Reading, p.True)));
        GrowthWindow window = RunThermalSummary.GrowthWindowOf(run);
        if (!(window.EndS > window.StartS))
        {
            return (null, $"run {run.Name} has no growth window");
        }
        ThermalExposure exposure = ThermalExposure.FromRecord(record, calibration, window);
        return exposure.CoveredS > 0 ? (exposure, null) : (null, $"the stored record of run {run.Name} covers none of its growth window");
    }

    /// <summary>The newest accepted, readable diffusion model of <paramref name="process"/> with its record id, or null.</summary>
    public static async Task<(ModelFitRecord Record, DiffusionModelParams Params)?> AcceptedModelAsync(IWaferStore wafers, string process, CancellationToken cancellationToken)
    {
        foreach (ModelFitRecord fit in await wafers.GetModelFitsAsync(process, ModelKinds.Diffusion, 50, cancellationToken).ConfigureAwait(false))
        {
            if (fit.AcceptedAt is null)
            {
                continue;
            }
            try
            {
                DiffusionModelParams p = Core.Model.ModelJson.Deserialize<DiffusionModelParams>(fit.ParamsJson);
                if (p.Model is { Lambda0SquaredUm2: > 0, KappaNm2PerUm2S: > 0 })
                {
                    return (fit, p);
                }
            }
            catch (System.Text.Json.JsonException)
            {
                // An unreadable record is skipped; the next older accepted one is used.
            }
        }
        return null;
    }
}
