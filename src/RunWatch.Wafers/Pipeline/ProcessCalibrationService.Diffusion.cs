using RunWatch.Core.Model;
using RunWatch.Core.Model.Diffusion;
using RunWatch.Core.Thermal;
using RunWatch.Core.Wafers;
using RunWatch.Storage;

namespace RunWatch.Wafers.Pipeline;

/// <summary>The diffusion-model refit of a process from its stored wafers.</summary>
public sealed partial class ProcessCalibrationService
{
    /// <summary>
    /// Fits the diffusion radius model to every stored wafer of <paramref name="process"/> that has analysed fields and
    /// a run with a thermal record over its growth window (latest analysis of each field; every object a sink; the
    /// counted wires' radii as data) and stores the result: a proposal (<see cref="ModelKinds.Diffusion"/>, with the
    /// process's mean wire density for run-end estimates) or, when the data cannot locate λ, the refusal with its plain
    /// reason (<see cref="ModelKinds.DiffusionRefusal"/>). Nothing is stored when no wafer could enter the fit.
    /// </summary>
    public async Task<DiffusionRefit> ProposeDiffusionModelAsync(string process, CancellationToken cancellationToken)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(process);
        if (store is null)
        {
            return new DiffusionRefit(null, null, [], "this host has no telemetry store, so no run's thermal record can be read");
        }
        WaferPipelineOptions settings = options?.Value ?? new WaferPipelineOptions();
        var tableOptions = new CaptureTableOptions { CellSizeUm = settings.CaptureCellNm / 1000 };
        var history = new RunGrowthHistory(store);
        var inputs = new List<DiffusionWafer>();
        var skipped = new List<string>();
        var used = new SortedSet<string>(StringComparer.Ordinal);
        double densitySum = 0;
        int densityCount = 0;
        foreach (WaferRecord wafer in await wafers.ListWafersAsync(MaxWafers, cancellationToken).ConfigureAwait(false))
        {
            if (wafer.Process != process)
            {
                continue;
            }
            List<FieldResult> fields = await AnalysedFieldsAsync(wafer.Name, cancellationToken).ConfigureAwait(false);
            if (fields.Count == 0)
            {
                skipped.Add($"{wafer.Name}: no analysed field");
                continue;
            }
            RunRecord? run = await wafers.FindRunOfWaferAsync(wafer.Name, cancellationToken).ConfigureAwait(false);
            (ThermalExposure? exposure, string? missing) = await history.LoadAsync(run, cancellationToken).ConfigureAwait(false);
            if (exposure is null)
            {
                skipped.Add($"{wafer.Name}: {missing}");
                continue;
            }
            foreach (FieldResult field in fields)
            {
                FieldSinks sinks = FieldSinks.From(field);
                if (!Array.Exists(sinks.MeasuredRadiiNm, double.IsFinite))
                {
                    continue;
                }
                // Each field's capture areas over the whole λ range the fit may try (seconds of CPU per field).
                CaptureAreaTable table = await Task.Run(() => CaptureAreaTable.Build(sinks.CentresUm, sinks.FootprintsUm, sinks.Field,
                    settings.CalibrationLambdaMinUm, settings.CalibrationLambdaMaxUm, tableOptions), cancellationToken).ConfigureAwait(false);
                inputs.Add(new DiffusionWafer(fields.Count == 1 ? wafer.Name : wafer.Name + "/" + field.FieldName, table, exposure, sinks.MeasuredRadiiNm));
                densitySum += sinks.DensityPerUm2;
                densityCount++;
                used.Add(wafer.Name);
            }
            if (!used.Contains(wafer.Name))
            {
                skipped.Add($"{wafer.Name}: no measured wire");
            }
        }
        if (inputs.Count == 0)
        {
            string why = skipped.Count == 0 ? $"process {process} has no stored wafer" : "no wafer has analysed fields and a run with a thermal record (" + string.Join("; ", skipped) + ")";
            return new DiffusionRefit(null, null, skipped, why);
        }
        DiffusionFitResult result = await Task.Run(() => DiffusionModelFitter.Fit(inputs), cancellationToken).ConfigureAwait(false);
        ModelFitRecord saved;
        if (result.Model is { } model)
        {
            saved = await wafers.SaveModelFitAsync(new ModelFitRecord
            {
                Process = process,
                Model = ModelKinds.Diffusion,
                FittedAt = time.GetUtcNow(),
                ParamsJson = ModelJson.Serialize(new DiffusionModelParams(model, densitySum / densityCount)),
                RmseNm = model.ResidualSdNm,
                Wafers = [.. used],
            }, cancellationToken).ConfigureAwait(false);
            return new DiffusionRefit(result, saved, skipped, null);
        }
        saved = await wafers.SaveModelFitAsync(new ModelFitRecord
        {
            Process = process,
            Model = ModelKinds.DiffusionRefusal,
            FittedAt = time.GetUtcNow(),
            ParamsJson = ModelJson.Serialize(result),
            Wafers = [.. used],
        }, cancellationToken).ConfigureAwait(false);
        return new DiffusionRefit(result, saved, skipped, result.Refusal);
    }

    private async Task<List<FieldResult>> AnalysedFieldsAsync(string wafer, CancellationToken cancellationToken)
    {
        var fields = new List<FieldResult>();
        foreach (FieldRecord field in await wafers.GetFieldsOfWaferAsync(wafer, cancellationToken).ConfigureAwait(false))
        {
            if (field.Status != FieldStatus.Analysed)
            {
                continue;
            }
            AnalysisRecord? analysis = await wafers.GetLatestAnalysisAsync(field.Id, cancellationToken).ConfigureAwait(false);
            if (analysis?.ResultsJson is { } json)
            {
                fields.Add(FieldResultJson.Read(json));
            }
        }
        return fields;
    }
}
