using System.Text.Json;
using RunWatch.Storage;

namespace RunWatch.Wafers.Records;

/// <summary>
/// Checks a report revision against its record: recomputes every file's SHA-256 and the content hash, compares them
/// with the manifest and, when a store is given, with the store's row; recomputes the input images' hashes where the
/// images are still present.
/// </summary>
public static class ReportRevisionVerifier
{
    /// <summary>
    /// Verifies the revision that <paramref name="reportPath"/> names: its folder, its <c>revision.json</c>, or any
    /// file in it.
    /// </summary>
    public static async Task<ReportVerification> VerifyAsync(string reportPath, IReportRevisionStore? store, CancellationToken cancellationToken)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(reportPath);
        var problems = new List<string>();
        var notes = new List<string>();
        string folder = Directory.Exists(reportPath) ? reportPath : Path.GetDirectoryName(Path.GetFullPath(reportPath)) ?? ".";
        string manifestPath = Path.Combine(folder, ReportHashes.ManifestFileName);
        if (!File.Exists(reportPath) && !Directory.Exists(reportPath))
        {
            return new ReportVerification(null, 0, null, ["no such file or folder: " + reportPath], notes);
        }
        if (!File.Exists(manifestPath))
        {
            return new ReportVerification(null, 0, null, ["no " + ReportHashes.ManifestFileName + " in " + folder + ": this is not a report revision folder"], notes);
        }
        ReportRevisionManifest manifest;
        try
        {
            manifest = ReportHashes.ReadManifest(await File.ReadAllTextAsync(manifestPath, cancellationToken).ConfigureAwait(false));
        }
        catch (JsonException ex)
        {
            return new ReportVerification(null, 0, null, [ReportHashes.ManifestFileName + " cannot be read: " + ex.Message], notes);
        }

        var recomputed = new List<ReportManifestFile>();
        foreach (ReportManifestFile f in manifest.Files)
        {
            string path = Path.Combine(folder, Path.GetFileName(f.Name));
            if (!File.Exists(path))
            {
                problems.Add($"{f.Name} is missing");
                recomputed.Add(f with { Sha256 = "missing" });
                continue;
            }
            string sha = ReportHashes.OfFile(path);
            long length = new FileInfo(path).Length;
            if (!string.Equals(sha, f.Sha256, StringComparison.Ordinal))
            {
                problems.Add($"{f.Name} has changed since it was issued: SHA-256 {sha}, issued as {f.Sha256}");
            }
            recomputed.Add(f with { Sha256 = sha, Bytes = length });
        }
        string content = ReportHashes.ContentHash(recomputed);
        if (!string.Equals(content, manifest.ContentSha256, StringComparison.Ordinal))
        {
            problems.Add($"content hash {content} differs from the issued {manifest.ContentSha256}");
        }
        string listingPath = Path.Combine(folder, ReportHashes.ListingFileName);
        byte[] listing = File.Exists(listingPath) ? await File.ReadAllBytesAsync(listingPath, cancellationToken).ConfigureAwait(false) : [];
        if (!ReportHashes.Listing(manifest.Files).SequenceEqual(listing))
        {
            problems.Add(ReportHashes.ListingFileName + " is missing or does not match " + ReportHashes.ManifestFileName);
        }

        foreach (ReportInputHash input in manifest.Inputs)
        {
            if (!File.Exists(input.Path))
            {
                notes.Add($"input {input.File} is no longer at {input.Path}; its hash was not checked");
                continue;
            }
            string sha = ReportHashes.OfFile(input.Path);
            if (!string.Equals(sha, input.Sha256, StringComparison.OrdinalIgnoreCase))
            {
                problems.Add($"input image {input.File} has changed since the report was made: SHA-256 {sha}, recorded as {input.Sha256}");
            }
        }

        if (store is null)
        {
            notes.Add("no store given: checked against the revision's own manifest only");
        }
        else
        {
            ReportRevisionRecord? stored = null;
            foreach (ReportRevisionRecord r in await store.GetReportRevisionsAsync(manifest.Wafer, cancellationToken).ConfigureAwait(false))
            {
                if (r.Revision == manifest.Revision)
                {
                    stored = r;
                }
            }
            if (stored is null)
            {
                notes.Add($"the store has no revision {manifest.Revision} of wafer {manifest.Wafer}; checked against the manifest only");
            }
            else if (!string.Equals(stored.ContentSha256, content, StringComparison.Ordinal))
            {
                problems.Add($"the store records content hash {stored.ContentSha256} for revision {manifest.Revision} of wafer {manifest.Wafer}, the files give {content}");
            }
        }
        return new ReportVerification(manifest.Wafer, manifest.Revision, content, problems, notes);
    }
}
