using System.Globalization;

namespace RunWatch.Storage;

/// <summary>Where the wafer pipeline keeps files beside a wafer's reports; one convention for writers and readers.</summary>
public static class WaferFiles
{
    /// <summary>The overlay PNG of field <paramref name="fieldId"/> inside the wafer's report folder.</summary>
    public static string OverlayPath(string waferFolder, long fieldId) =>
        Path.Combine(waferFolder, "fields", "field-" + fieldId.ToString(CultureInfo.InvariantCulture) + "-overlay.png");

    /// <summary>Name of the manifest that marks a report revision's folder (<c>reports/{wafer}/r{N}/</c>).</summary>
    public const string RevisionManifestName = "revision.json";

    /// <summary>
    /// The wafer's folder (where overlays are) of a report file: the file's own folder, or its parent when the file
    /// lies in a revision folder.
    /// </summary>
    public static string WaferFolderOfReport(string reportFilePath)
    {
        string folder = Path.GetDirectoryName(Path.GetFullPath(reportFilePath)) ?? ".";
        return File.Exists(Path.Combine(folder, RevisionManifestName)) ? Path.GetDirectoryName(folder) ?? folder : folder;
    }
}
