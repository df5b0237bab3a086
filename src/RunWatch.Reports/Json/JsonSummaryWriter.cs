using System.Text.Json;
using System.Text.Json.Serialization;
using RunWatch.Reports.Model;

namespace RunWatch.Reports.Json;

/// <summary>Writes and reads the JSON summary (camelCase, enums as names, NaN as "NaN").</summary>
public static class JsonSummaryWriter
{
    /// <summary>Version of <see cref="WaferReportSummary"/> written now.</summary>
    public const int SchemaVersion = 1;

    private static readonly JsonSerializerOptions Options = CreateOptions();

    /// <summary>Builds the summary of a report.</summary>
    public static WaferReportSummary Summarise(WaferReport report)
    {
        ArgumentNullException.ThrowIfNull(report);
        ThermalSummary t = report.Thermal;
        var thermal = new ThermalFigures(t.SetpointC, t.GrowthWindowStartS, t.GrowthWindowEndS, t.NominalLengthNm, t.EffectiveLengthNm,
            t.EffectiveTemperatureC, t.ConventionFactor, t.CoverageFraction, t.GapPolicy, t.TimesS.Count, t.Excursions);
        ComparisonFigures? comparison = report.Comparison is { } c
            ? new ComparisonFigures(c.Count, c.RSquared, c.RmseNm, c.BiasNm, c.MeanAbsoluteErrorNm)
            : null;
        var fields = report.Fields.Select(f => new FieldFigures(f.FieldName, f.WireCount, f.Caption)).ToArray();
        return new WaferReportSummary(SchemaVersion, report.Identity, thermal, report.Statistics, report.Model, report.CaptureRadiusNm,
            report.Prediction, comparison, report.Verdict, fields, ReportWording.Caution, report.Diffusion)
        {
            Provenance = report.Provenance,
        };
    }

    /// <summary>The summary as indented JSON.</summary>
    public static string Write(WaferReport report) => JsonSerializer.Serialize(Summarise(report), Options);

    /// <summary>Reads a summary back.</summary>
    /// <exception cref="JsonException">Malformed JSON.</exception>
    public static WaferReportSummary Read(string json) =>
        JsonSerializer.Deserialize<WaferReportSummary>(json, Options) ?? throw new JsonException("JSON 'null' is not a report summary.");

    private static JsonSerializerOptions CreateOptions()
    {
        var options = new JsonSerializerOptions(JsonSerializerDefaults.Web)
        {
            WriteIndented = true,
            NumberHandling = JsonNumberHandling.AllowNamedFloatingPointLiterals,
        };
        options.Converters.Add(new JsonStringEnumConverter());
        options.MakeReadOnly(populateMissingResolver: true);
        return options;
    }
}
