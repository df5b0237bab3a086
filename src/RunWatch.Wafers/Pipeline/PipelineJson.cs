using System.Text.Json;

namespace RunWatch.Wafers.Pipeline;

/// <summary>JSON settings for the analysis settings the wafer pipeline stores (field results go through Storage's <c>FieldResultJson</c>).</summary>
internal static class PipelineJson
{
    public static JsonSerializerOptions Options { get; } = new(JsonSerializerDefaults.Web)
    {
        NumberHandling = System.Text.Json.Serialization.JsonNumberHandling.AllowNamedFloatingPointLiterals,
    };
}
