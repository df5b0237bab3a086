using System.Text.Json;
using System.Text.Json.Serialization;
using RunWatch.Core.Wafers;

namespace RunWatch.Storage;

/// <summary>
/// The one place where a field's analysis result (Core's <see cref="FieldResult"/>) becomes the text of
/// <see cref="AnalysisRecord.ResultsJson"/> and back: the wafer room writes it, the wafer room and the dashboard read
/// it typed through here.
/// </summary>
public static class FieldResultJson
{
    private static readonly JsonSerializerOptions Options = new(JsonSerializerDefaults.Web)
    {
        NumberHandling = JsonNumberHandling.AllowNamedFloatingPointLiterals,
    };

    /// <summary>The result as stored.</summary>
    public static string Write(FieldResult result) => JsonSerializer.Serialize(result, Options);

    /// <summary>A stored result.</summary>
    /// <exception cref="InvalidDataException">The text holds no result.</exception>
    /// <exception cref="JsonException">The text is not a result.</exception>
    public static FieldResult Read(string json) =>
        JsonSerializer.Deserialize<FieldResult>(json, Options) ?? throw new InvalidDataException("the stored analysis holds no field result");
}
