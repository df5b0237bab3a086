using System.Text.Json.Serialization;

namespace RunWatch.Ingest.Health;

/// <summary>Source-generated JSON for the values health checks report.</summary>
[JsonSerializable(typeof(string))]
[JsonSerializable(typeof(int))]
[JsonSerializable(typeof(long))]
[JsonSerializable(typeof(double))]
[JsonSerializable(typeof(bool))]
[JsonSerializable(typeof(DateTimeOffset))]
[JsonSerializable(typeof(string[]))]
internal sealed partial class HealthJsonContext : JsonSerializerContext
{
}
