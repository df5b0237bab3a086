using System.Text.Json;
using System.Text.Json.Serialization;

namespace RunWatch.Core.Model;

/// <summary>JSON form of fit records and model state (System.Text.Json, camelCase, enums as names).</summary>
public static class ModelJson
{
    /// <summary>The serializer options used for every model record.</summary>
    public static JsonSerializerOptions Options { get; } = CreateOptions();

    /// <summary>Serialises a model record.</summary>
    public static string Serialize<T>(T value) => JsonSerializer.Serialize(value, Options);

    /// <summary>Deserialises a model record.</summary>
    /// <exception cref="JsonException">Malformed JSON, or JSON of another shape.</exception>
    public static T Deserialize<T>(string json) =>
        JsonSerializer.Deserialize<T>(json, Options) ?? throw new JsonException($"JSON 'null' is not a {typeof(T).Name}.");

    private static JsonSerializerOptions CreateOptions()
    {
        var options = new JsonSerializerOptions(JsonSerializerDefaults.Web)
        {
            WriteIndented = true,
            // r² is NaN when all radii are equal; keep it rather than fail the record.
            NumberHandling = JsonNumberHandling.AllowNamedFloatingPointLiterals,
        };
        options.Converters.Add(new JsonStringEnumConverter());
        options.MakeReadOnly(populateMissingResolver: true);
        return options;
    }
}
