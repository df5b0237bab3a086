using System.Text.Json.Serialization;

namespace RunWatch.Hosting;

/// <summary>Source-generated JSON for the few strings <c>runwatch replay</c> escapes.</summary>
[JsonSerializable(typeof(string))]
internal sealed partial class ReplayJsonContext : JsonSerializerContext
{
}
