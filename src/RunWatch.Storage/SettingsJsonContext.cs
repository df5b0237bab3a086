using System.Text.Json.Serialization;
using RunWatch.Core.Qc;

namespace RunWatch.Storage;

/// <summary>Source-generated JSON for stored settings; enums by name so a stored row reads plainly.</summary>
[JsonSourceGenerationOptions(UseStringEnumConverter = true, DefaultIgnoreCondition = JsonIgnoreCondition.WhenWritingNull)]
[JsonSerializable(typeof(QcSpecification))]
[JsonSerializable(typeof(Dictionary<string, string>))]
internal sealed partial class SettingsJsonContext : JsonSerializerContext
{
}
