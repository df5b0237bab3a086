using System.Text.Json;

namespace RunWatch.Storage;

/// <summary>The one place where a revision's input list becomes text and back.</summary>
public static class ReportRevisionJson
{
    public static string WriteInputs(IReadOnlyList<ReportInputHash> inputs) =>
        JsonSerializer.Serialize(inputs, StorageJsonContext.Default.IReadOnlyListReportInputHash);

    public static IReadOnlyList<ReportInputHash> ReadInputs(string json) =>
        JsonSerializer.Deserialize(json, StorageJsonContext.Default.IReadOnlyListReportInputHash) ?? [];
}
