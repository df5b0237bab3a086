using System.Text.Json;
using System.Text.Json.Serialization;

namespace RunWatch.Imaging.Reporting;

/// <summary>JSON settings for field analyses: camelCase, enums as strings, NaN written as the string "NaN".</summary>
public static class FieldAnalysisJson
{
    /// <summary>Version of the <c>runwatch analyze --json</c> document.</summary>
    public const string Format = "runwatch-analysis/1";

    public static JsonSerializerOptions Options { get; } = new()
    {
        PropertyNamingPolicy = JsonNamingPolicy.CamelCase,
        DefaultIgnoreCondition = JsonIgnoreCondition.WhenWritingNull,
        NumberHandling = JsonNumberHandling.AllowNamedFloatingPointLiterals,
        Converters = { new JsonStringEnumConverter(JsonNamingPolicy.CamelCase) },
        WriteIndented = true,
    };
}
