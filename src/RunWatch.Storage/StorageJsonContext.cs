using System.Text.Json.Serialization;

namespace RunWatch.Storage;

/// <summary>Source-generated JSON for the small documents the store keeps in text columns.</summary>
[JsonSerializable(typeof(IReadOnlyList<CalibrationPoint>))]
[JsonSerializable(typeof(IReadOnlyList<string>))]
[JsonSerializable(typeof(IReadOnlyList<ReportInputHash>))]
internal sealed partial class StorageJsonContext : JsonSerializerContext
{
}
