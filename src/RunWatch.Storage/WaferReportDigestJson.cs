using System.Text.Json;
using System.Text.Json.Serialization;

namespace RunWatch.Storage;

/// <summary>
/// The one place where a <see cref="WaferReportDigest"/> becomes text and back (camelCase, enums as names, NaN as
/// "NaN"). The property names are those of the JSON report summary, so digests stored as the whole summary read too.
/// </summary>
public static class WaferReportDigestJson
{
    private static readonly JsonSerializerOptions Options = CreateOptions();

    /// <summary>The digest as stored.</summary>
    public static string Write(WaferReportDigest digest) => JsonSerializer.Serialize(digest, Options);

    /// <summary>A stored digest; text that is not one gives an empty digest (nothing shown), not an exception.</summary>
    public static WaferReportDigest Read(string json)
    {
        try
        {
            return JsonSerializer.Deserialize<WaferReportDigest>(json, Options) ?? new WaferReportDigest(null, null, null);
        }
        catch (JsonException)
        {
            return new WaferReportDigest(null, null, null);
        }
    }

    private static JsonSerializerOptions CreateOptions()
    {
        var options = new JsonSerializerOptions(JsonSerializerDefaults.Web) { NumberHandling = JsonNumberHandling.AllowNamedFloatingPointLiterals };
        options.Converters.Add(new JsonStringEnumConverter());
        options.MakeReadOnly(populateMissingResolver: true);
        return options;
    }
}
