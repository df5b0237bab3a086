using System.Globalization;

namespace RunWatch.Storage;

/// <summary>Where the wafer pipeline keeps files beside a wafer's reports; one convention for writers and readers.</summary>
public static class WaferFiles
{
    /// <summary>The overlay PNG of field <paramref name="fieldId"/> inside the wafer's report folder.</summary>
    public static string OverlayPath(string waferFolder, long fieldId) =>
        Path.Combine(waferFolder, "fields", "field-" + fieldId.ToString(CultureInfo.InvariantCulture) + "-overlay.png");
}
