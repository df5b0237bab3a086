using System.Text.Json;

namespace RunWatch.Storage;

/// <summary>
/// The one place where a run's thermal summary and excursions become the text of the runs table and back. Every
/// store implementation calls it; no other room sees the JSON.
/// </summary>
public static class RunThermalJson
{
    /// <summary>The summary as stored; null for none.</summary>
    public static string? Write(RunThermalSummary? summary) =>
        summary is null ? null : JsonSerializer.Serialize(summary, RunThermalJsonContext.Default.RunThermalSummary);

    /// <summary>The excursions as stored; null for none computed.</summary>
    public static string? Write(IReadOnlyList<RunExcursionRecord>? excursions) =>
        excursions is null ? null : JsonSerializer.Serialize(excursions.ToList(), RunThermalJsonContext.Default.ListRunExcursionRecord);

    /// <summary>A stored summary; a text that cannot be read gives a summary that says so, not an exception.</summary>
    public static RunThermalSummary? ReadSummary(string? json)
    {
        if (string.IsNullOrEmpty(json))
        {
            return null;
        }
        try
        {
            return JsonSerializer.Deserialize(json, RunThermalJsonContext.Default.RunThermalSummary);
        }
        catch (JsonException ex)
        {
            return RunThermalSummary.Failed("the stored summary cannot be read: " + ex.Message);
        }
    }

    /// <summary>Stored excursions; a text that cannot be read gives null (not computed), not an exception.</summary>
    public static IReadOnlyList<RunExcursionRecord>? ReadExcursions(string? json)
    {
        if (string.IsNullOrEmpty(json))
        {
            return null;
        }
        try
        {
            return JsonSerializer.Deserialize(json, RunThermalJsonContext.Default.ListRunExcursionRecord);
        }
        catch (JsonException)
        {
            return null;
        }
    }
}
