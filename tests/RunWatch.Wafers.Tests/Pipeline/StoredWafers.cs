using System.Globalization;
using System.Text.Json;
using RunWatch.Core.Model;
using RunWatch.Core.Wafers;
using RunWatch.Wafers.Pipeline;
using RunWatch.Storage;

namespace RunWatch.Wafers.Tests.Pipeline;

/// <summary>Puts invented, already analysed wafers into a store: one field per wafer, its analysis, and optionally its capture-radius point.</summary>
internal static class StoredWafers
{
    public static async Task AddAsync(IWaferStore store, string wafer, string process, IReadOnlyList<FieldWire> wires, ArrheniusPoint? capture = null)
    {
        await store.UpsertWaferAsync(wafer, null, process, CancellationToken.None);
        var (field, _) = await store.AddFieldAsync(new FieldRecord
        {
            Wafer = wafer,
            FilePath = "fields/" + wafer + ".png",
            RelativePath = wafer + ".png",
            Sha256 = Convert.ToHexString(System.Security.Cryptography.SHA256.HashData(System.Text.Encoding.UTF8.GetBytes(wafer))),
            ImportedAt = DateTimeOffset.UnixEpoch,
            Status = FieldStatus.Analysed,
            NmPerPx = 5,
        }, CancellationToken.None);
        var result = new FieldResult
        {
            FieldName = wafer + ".png",
            PixelSizeNm = 5,
            WidthNm = 20_000,
            AnalysedHeightNm = 20_000,
            Threshold = "otsu",
            AnalysedAreaCm2 = 4e-6,
            Wires = wires,
        };
        await store.SaveAnalysisAsync(new AnalysisRecord
        {
            FieldId = field.Id,
            StartedAt = DateTimeOffset.UnixEpoch,
            FinishedAt = DateTimeOffset.UnixEpoch,
            Status = "done",
            WireCount = wires.Count,
            ResultsJson = FieldResultJson.Write(result),
        }, CancellationToken.None);
        if (capture is not null)
        {
            await store.SaveModelFitAsync(new ModelFitRecord
            {
                Process = process,
                Model = ModelKinds.CaptureRadius,
                FittedAt = DateTimeOffset.UnixEpoch,
                ParamsJson = ModelJson.Serialize(capture),
                Wafers = [wafer],
            }, CancellationToken.None);
        }
    }

    /// <summary>Wires on a grid with r = a + b·Â plus seeded noise; every fifth wire leans or touches the edge (left out of fits).</summary>
    public static List<FieldWire> Linear(int count, double a, double b, double noiseNm, int seed)
    {
        var random = new Random(seed);
        var wires = new List<FieldWire>(count);
        for (int i = 0; i < count; i++)
        {
            double area = 0.3 + (1.5 * random.NextDouble());
            double noise = noiseNm * (random.NextDouble() + random.NextDouble() + random.NextDouble() - 1.5);
            bool counted = i % 5 != 4;
            wires.Add(new FieldWire(i, 100 + (i % 20 * 900), 100 + (i / 20 * 900), a + (b * area) + noise, counted || i % 2 == 0, counted, area));
        }
        return wires;
    }

    public static string Name(string prefix, int i) => prefix + "-" + i.ToString(CultureInfo.InvariantCulture);
}
