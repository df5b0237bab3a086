using System.Text.Json.Serialization;

namespace RunWatch.Storage;

/// <summary>Source-generated JSON of a run's thermal documents (camelCase, as the runs table has always held them).</summary>
[JsonSourceGenerationOptions(PropertyNamingPolicy = JsonKnownNamingPolicy.CamelCase, NumberHandling = JsonNumberHandling.Strict,
    UseStringEnumConverter = true)]
[JsonSerializable(typeof(List<RunExcursionRecord>))]
[JsonSerializable(typeof(RunThermalSummary))]
internal sealed partial class RunThermalJsonContext : JsonSerializerContext
{
}
