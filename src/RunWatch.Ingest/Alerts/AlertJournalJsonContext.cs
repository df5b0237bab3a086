using System.Text.Json.Serialization;

namespace RunWatch.Ingest.Alerts;

/// <summary>Source-generated JSON for the alert journal (one <see cref="Storage.AlertRecord"/> per line).</summary>
[JsonSourceGenerationOptions(UseStringEnumConverter = true)]
[JsonSerializable(typeof(Storage.AlertRecord))]
internal sealed partial class AlertJournalJsonContext : JsonSerializerContext
{
}
