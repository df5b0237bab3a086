using System.Security.Cryptography;
using System.Text;
using System.Text.Json;

namespace RunWatch.Wafers.Records;

/// <summary>
/// The hashes that make a report revision checkable. The content listing is exactly what GNU
/// <c>sha256sum FILE...</c> prints (hex, two spaces, file name, LF), so <c>sha256sum -c content.sha256</c> checks the
/// files and <c>sha256sum content.sha256</c> gives the content hash without RunWatch.
/// </summary>
public static class ReportHashes
{
    /// <summary>Name of the listing file in a revision folder.</summary>
    public const string ListingFileName = "content.sha256";

    /// <summary>Name of the manifest in a revision folder.</summary>
    public const string ManifestFileName = RunWatch.Storage.WaferFiles.RevisionManifestName;

    private static readonly JsonSerializerOptions ManifestJson = new(JsonSerializerDefaults.Web) { WriteIndented = true };

    /// <summary>SHA-256 of a file, lower-case hex.</summary>
    public static string OfFile(string path)
    {
        using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, 1 << 16);
        return Convert.ToHexStringLower(SHA256.HashData(stream));
    }

    /// <summary>SHA-256 of bytes, lower-case hex.</summary>
    public static string Of(ReadOnlySpan<byte> bytes) => Convert.ToHexStringLower(SHA256.HashData(bytes));

    /// <summary>The listing of <paramref name="files"/> in sha256sum's format (UTF-8 bytes).</summary>
    public static byte[] Listing(IReadOnlyList<ReportManifestFile> files)
    {
        ArgumentNullException.ThrowIfNull(files);
        var text = new StringBuilder();
        foreach (ReportManifestFile f in files)
        {
            text.Append(f.Sha256).Append("  ").Append(f.Name).Append('\n');
        }
        return new UTF8Encoding(false).GetBytes(text.ToString());
    }

    /// <summary>The content hash: SHA-256 of the listing.</summary>
    public static string ContentHash(IReadOnlyList<ReportManifestFile> files) => Of(Listing(files));

    public static string WriteManifest(ReportRevisionManifest manifest) => JsonSerializer.Serialize(manifest, ManifestJson);

    /// <exception cref="JsonException">Not a revision manifest.</exception>
    public static ReportRevisionManifest ReadManifest(string json) =>
        JsonSerializer.Deserialize<ReportRevisionManifest>(json, ManifestJson) ?? throw new JsonException("'null' is not a revision manifest");
}
