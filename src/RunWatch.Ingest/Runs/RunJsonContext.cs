using System.Text.Json;
using System.Text.Json.Serialization;

namespace RunWatch.Ingest.Runs;

/// <summary>Source-generated JSON for run documents (camelCase).</summary>
[JsonSourceGenerationOptions(PropertyNamingPolicy = JsonKnownNamingPolicy.CamelCase, NumberHandling = JsonNumberHandling.Strict)]
[JsonSerializable(typeof(List<RunExcursionJson>))]
[JsonSerializable(typeof(RunSummaryJson))]
internal sealed partial class RunJsonContext : JsonSerializerContext
{
}
