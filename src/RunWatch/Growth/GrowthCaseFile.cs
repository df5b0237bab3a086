using System.Globalization;
using System.Text.Json;
using RunWatch.Thermal;

namespace RunWatch.Growth;

/// <summary>
/// Reads a case file, format <c>growth-cases/1</c>:
/// <c>{"format":"growth-cases/1","wafers":[{"wafer":"W1","thermalLog":"w1.csv","channel":"substrate_tc",
/// "growthFrom":"2026-03-02T08:15:00Z","growthTo":"2026-03-02T08:45:00Z","image":"w1.png","pixelSizeNm":10}]}</c>.
/// Paths are relative to the case file. Every problem names the file and the field (<c>wafers[2].pixelSizeNm</c>).
/// </summary>
internal static class GrowthCaseFile
{
    public const string Format = "growth-cases/1";

    public static IReadOnlyList<GrowthCase> Read(string path)
    {
        string text;
        try
        {
            text = File.ReadAllText(path);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            throw new GrowthCaseException(path, "file", "cannot be read: " + ex.Message);
        }
        JsonDocument document;
        try
        {
            document = JsonDocument.Parse(text);
        }
        catch (JsonException ex)
        {
            throw new GrowthCaseException(path, "file", $"is not valid JSON (line {ex.LineNumber + 1}): {ex.Message}");
        }
        using (document)
        {
            JsonElement root = document.RootElement;
            if (root.ValueKind != JsonValueKind.Object)
            {
                throw new GrowthCaseException(path, "file", "must hold a JSON object");
            }
            string format = String(root, "format", path, "format");
            if (format != Format)
            {
                throw new GrowthCaseException(path, "format", $"is '{format}'; this version reads '{Format}'");
            }
            if (!root.TryGetProperty("wafers", out JsonElement wafers) || wafers.ValueKind != JsonValueKind.Array)
            {
                throw new GrowthCaseException(path, "wafers", "is missing or not an array");
            }
            string folder = Path.GetDirectoryName(Path.GetFullPath(path)) ?? ".";
            var cases = new List<GrowthCase>();
            int index = 0;
            foreach (JsonElement w in wafers.EnumerateArray())
            {
                string at = $"wafers[{index}]";
                if (w.ValueKind != JsonValueKind.Object)
                {
                    throw new GrowthCaseException(path, at, "must be an object");
                }
                string wafer = String(w, "wafer", path, at + ".wafer");
                string log = Path.GetFullPath(Path.Combine(folder, String(w, "thermalLog", path, at + ".thermalLog")));
                string channel = String(w, "channel", path, at + ".channel");
                GrowthInstant from = Instant(w, "growthFrom", path, at + ".growthFrom");
                GrowthInstant to = Instant(w, "growthTo", path, at + ".growthTo");
                string image = Path.GetFullPath(Path.Combine(folder, String(w, "image", path, at + ".image")));
                if (!w.TryGetProperty("pixelSizeNm", out JsonElement px) || px.ValueKind != JsonValueKind.Number || !px.TryGetDouble(out double pixel) || !(pixel > 0) || !double.IsFinite(pixel))
                {
                    throw new GrowthCaseException(path, at + ".pixelSizeNm", "must be a positive number");
                }
                if (cases.Exists(c => c.Wafer == wafer))
                {
                    throw new GrowthCaseException(path, at + ".wafer", $"'{wafer}' is listed twice");
                }
                cases.Add(new GrowthCase(wafer, log, channel, from, to, image, pixel));
                index++;
            }
            if (cases.Count == 0)
            {
                throw new GrowthCaseException(path, "wafers", "is empty");
            }
            return cases;
        }
    }

    private static string String(JsonElement parent, string name, string file, string field)
    {
        if (!parent.TryGetProperty(name, out JsonElement e) || e.ValueKind != JsonValueKind.String || string.IsNullOrWhiteSpace(e.GetString()))
        {
            throw new GrowthCaseException(file, field, "is missing or not a non-empty string");
        }
        return e.GetString()!;
    }

    private static GrowthInstant Instant(JsonElement parent, string name, string file, string field)
    {
        if (!parent.TryGetProperty(name, out JsonElement e))
        {
            throw new GrowthCaseException(file, field, "is missing");
        }
        if (e.ValueKind == JsonValueKind.Number && e.TryGetDouble(out double s) && double.IsFinite(s))
        {
            return new GrowthInstant(null, s);
        }
        if (e.ValueKind == JsonValueKind.String && ThermalCsvReader.TryParseIso(e.GetString()!, out DateTimeOffset instant))
        {
            return new GrowthInstant(instant, null);
        }
        throw new GrowthCaseException(file, field, string.Create(CultureInfo.InvariantCulture,
            $"must be an ISO-8601 time with an offset (e.g. 2026-03-02T08:15:00Z) or seconds on the log's axis; got {e.GetRawText()}"));
    }
}
