using System.Globalization;
using Microsoft.VisualBasic.FileIO;
using RunWatch.Core.Wafers;
using RunWatch.Storage;
using RunWatch.Web.Data.Fields;

namespace RunWatch.Web.Data.Store;

/// <summary>
/// The full-field viewer's reads over the store: the field, its latest analysis (typed through
/// <see cref="FieldResultJson"/>), and the wafer's compared wires from the report's wire CSV (read with CsvHelper by
/// column name, with the framework's RFC 4180 reader), matched to fields by the analysed file name.
/// </summary>
public sealed class StoreFieldDetails(IWaferStore wafers, StoreWaferData waferData, IFieldImageRenderer? renderer = null, IFieldPipeline? pipeline = null) : IFieldDetails
{
    public async Task<FieldDetail?> GetFieldAsync(string fieldId, CancellationToken cancellationToken)
    {
        if (!long.TryParse(fieldId, NumberStyles.None, CultureInfo.InvariantCulture, out long id))
        {
            return null;
        }
        FieldRecord? field = await wafers.GetFieldAsync(id, cancellationToken).ConfigureAwait(false);
        if (field is null)
        {
            return null;
        }
        FieldQueueState state = FieldStates.Of(field, pipeline?.IsRunning(fieldId) == true);
        FieldResult? result = await LatestResultAsync(id, cancellationToken).ConfigureAwait(false);
        var parity = new List<ParityPoint>();
        var predicted = new Dictionary<int, double>();
        if (field.Wafer is { } wafer)
        {
            var names = new Dictionary<string, string>(StringComparer.Ordinal);
            foreach (FieldRecord sibling in await wafers.GetFieldsOfWaferAsync(wafer, cancellationToken).ConfigureAwait(false))
            {
                FieldResult? r = sibling.Id == id ? result : await LatestResultAsync(sibling.Id, cancellationToken).ConfigureAwait(false);
                if (r is not null)
                {
                    names.TryAdd(r.FieldName, sibling.Id.ToString(CultureInfo.InvariantCulture));
                }
            }
            var reports = await wafers.GetReportsAsync(wafer, cancellationToken).ConfigureAwait(false);
            if (reports.FirstOrDefault(r => r.Format == "csv") is { } csv && File.Exists(csv.FilePath))
            {
                foreach (var (fieldName, wireId, predictedNm, measuredNm) in ReadComparedWires(csv.FilePath))
                {
                    if (names.TryGetValue(fieldName, out string? owner))
                    {
                        parity.Add(new ParityPoint(owner, wireId, predictedNm, measuredNm));
                        if (owner == fieldId)
                        {
                            predicted[wireId] = predictedNm;
                        }
                    }
                }
            }
        }
        var wires = result?.Wires.Select(w => new FieldWireView(w.Id, w.XNm, w.YNm, w.RadiusNm, w.Vertical, w.Interior, w.ZoneNormalised,
            predicted.TryGetValue(w.Id, out double p) ? p : null)).ToList() ?? [];
        return new FieldDetail(fieldId, field.RelativePath, field.Wafer, state, field.Problem, result?.PixelSizeNm ?? field.NmPerPx ?? double.NaN,
            field.WidthPx ?? 0, field.HeightPx ?? 0, result?.AnalysedHeightNm ?? double.NaN, result?.DiffusionLengthNm, wires, parity);
    }

    public async Task<ReportFile?> GetFullImageAsync(string fieldId, bool analysisDrawn, CancellationToken cancellationToken)
    {
        if (analysisDrawn)
        {
            return await waferData.GetFieldImageAsync(fieldId, overlay: true, cancellationToken).ConfigureAwait(false);
        }
        if (!long.TryParse(fieldId, NumberStyles.None, CultureInfo.InvariantCulture, out long id)
            || await wafers.GetFieldAsync(id, cancellationToken).ConfigureAwait(false) is not { } field || !File.Exists(field.FilePath))
        {
            return null;
        }
        string extension = Path.GetExtension(field.FilePath).ToLowerInvariant();
        if (extension is ".png" or ".jpg" or ".jpeg")
        {
            return new ReportFile(Path.GetFileName(field.FilePath), extension == ".png" ? "image/png" : "image/jpeg",
                await File.ReadAllBytesAsync(field.FilePath, cancellationToken).ConfigureAwait(false));
        }
        byte[]? png = renderer is null ? null : await renderer.RenderPngAsync(field.FilePath, cancellationToken).ConfigureAwait(false);
        return png is null ? null : new ReportFile(Path.GetFileNameWithoutExtension(field.FilePath) + ".png", "image/png", png);
    }

    private async Task<FieldResult?> LatestResultAsync(long fieldId, CancellationToken cancellationToken)
    {
        AnalysisRecord? analysis = await wafers.GetLatestAnalysisAsync(fieldId, cancellationToken).ConfigureAwait(false);
        if (analysis is not { Status: "done", ResultsJson: { } json })
        {
            return null;
        }
        try
        {
            return FieldResultJson.Read(json);
        }
        catch (Exception ex) when (ex is InvalidDataException or System.Text.Json.JsonException)
        {
            return null;
        }
    }

    /// <summary>Wires with both radii from the report's wire CSV (columns by name; an empty cell is a value not available).</summary>
    internal static List<(string Field, int Wire, double Predicted, double Measured)> ReadComparedWires(string path)
    {
        var list = new List<(string, int, double, double)>();
        using var parser = new TextFieldParser(path) { TextFieldType = FieldType.Delimited, HasFieldsEnclosedInQuotes = true };
        parser.SetDelimiters(",");
        string[]? header = parser.ReadFields();
        if (header is null)
        {
            return list;
        }
        int field = Array.IndexOf(header, "field"), wire = Array.IndexOf(header, "wire");
        int radius = Array.IndexOf(header, "radius_nm"), predicted = Array.IndexOf(header, "predicted_radius_nm");
        if (field < 0 || wire < 0 || radius < 0 || predicted < 0)
        {
            return list;
        }
        while (parser.ReadFields() is { } cells)
        {
            if (cells.Length == header.Length
                && double.TryParse(cells[predicted], NumberStyles.Float, CultureInfo.InvariantCulture, out double p)
                && double.TryParse(cells[radius], NumberStyles.Float, CultureInfo.InvariantCulture, out double m)
                && int.TryParse(cells[wire], NumberStyles.Integer, CultureInfo.InvariantCulture, out int id)
                && double.IsFinite(p) && double.IsFinite(m))
            {
                list.Add((cells[field], id, p, m));
            }
        }
        return list;
    }
}
