using System.Text.Json;

namespace RunWatch.Wafers.Pipeline;

/// <summary>JSON settings for the records the wafer pipeline stores.</summary>
internal static class PipelineJson
{
    public static JsonSerializerOptions Options { get; } = new(JsonSerializerDefaults.Web)
    {
        NumberHandling = System.Text.Json.Serialization.JsonNumberHandling.AllowNamedFloatingPointLiterals,
    };
}
