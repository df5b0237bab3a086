using System.Text.Json.Serialization;

namespace RunWatch.Ingest.Alerts;

/// <summary>Source-generated JSON for alert messages (camelCase).</summary>
[JsonSourceGenerationOptions(PropertyNamingPolicy = JsonKnownNamingPolicy.CamelCase, DefaultIgnoreCondition = JsonIgnoreCondition.WhenWritingNull)]
[JsonSerializable(typeof(AlertJson))]
internal sealed partial class AlertJsonContext : JsonSerializerContext
{
}
