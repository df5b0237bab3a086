using System.Text.Json;

namespace RunWatch.Storage;

/// <summary>The audit table's detail column for a plain sentence: <c>{"detail":"..."}</c>, as the dashboard writes it.</summary>
public static class AuditDetail
{
    /// <summary>The detail as stored JSON.</summary>
    public static string Json(string detail) =>
        JsonSerializer.Serialize(new Dictionary<string, string> { ["detail"] = detail }, SettingsJsonContext.Default.DictionaryStringString);

    /// <summary>The sentence back from stored JSON: the <c>detail</c> string when present, else the JSON text itself.</summary>
    public static string Text(string? detailJson)
    {
        if (detailJson is not { Length: > 0 })
        {
            return "";
        }
        try
        {
            using var doc = JsonDocument.Parse(detailJson);
            return doc.RootElement.ValueKind == JsonValueKind.Object && doc.RootElement.TryGetProperty("detail", out JsonElement d)
                && d.ValueKind == JsonValueKind.String ? d.GetString() ?? "" : detailJson;
        }
        catch (JsonException)
        {
            return detailJson;
        }
    }
}
