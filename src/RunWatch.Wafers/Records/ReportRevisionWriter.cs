using RunWatch.Reports;
using RunWatch.Reports.Model;
using RunWatch.Storage;

namespace RunWatch.Wafers.Records;

/// <summary>
/// Writes a wafer report as its next revision: a new folder <c>r{N}</c> that is never overwritten, holding the four
/// report files, <c>content.sha256</c> and <c>revision.json</c>, and stores the revision. The folder is filled under a
/// temporary name and moved into place only when complete; a number already taken (on disk or in the store, by a
/// daemon sharing the store) moves on to the next.
/// </summary>
public static class ReportRevisionWriter
{
    private const int Attempts = 5;

    /// <summary>Folder of revision <paramref name="revision"/> under a wafer's report folder.</summary>
    public static string RevisionFolder(string waferFolder, int revision) =>
        Path.Combine(waferFolder, "r" + revision.ToString(System.Globalization.CultureInfo.InvariantCulture));

    /// <summary>Writes and stores the next revision; returns the stored row and the paths of its report files.</summary>
    /// <exception cref="IOException">No free revision number after several attempts, or the folder cannot be written.</exception>
    public static async Task<(ReportRevisionRecord Revision, ReportFiles Files)> WriteAsync(WaferReport report, ReportRevisionRequest request,
        IReportRevisionStore store, string softwareVersion, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(report);
        ArgumentNullException.ThrowIfNull(request);
        ArgumentNullException.ThrowIfNull(store);
        string configSha = ReportHashes.Of(System.Text.Encoding.UTF8.GetBytes(request.ConfigJson));
        int next = 1;
        foreach (ReportRevisionRecord r in await store.GetReportRevisionsAsync(request.Wafer, cancellationToken).ConfigureAwait(false))
        {
            next = Math.Max(next, r.Revision + 1);
        }
        Directory.CreateDirectory(request.Folder);
        for (int attempt = 0; attempt < Attempts; attempt++, next++)
        {
            string target = RevisionFolder(request.Folder, next);
            if (Directory.Exists(target))
            {
                continue; // files of a revision are never replaced
            }
            var provenance = new ReportProvenance(next, request.Reason, request.Requester, configSha, request.ModelId,
                [.. request.Inputs.Select(i => new ReportInputFile(i.File, i.Sha256))]);
            WaferReport issued = report with { Provenance = provenance };
            string staging = Path.Combine(request.Folder, ".writing-r" + next.ToString(System.Globalization.CultureInfo.InvariantCulture) + "-" + Guid.NewGuid().ToString("N"));
            string stem = WaferReportWriter.SafeFileName(request.Wafer) + "-r" + next.ToString(System.Globalization.CultureInfo.InvariantCulture);
            ReportFiles staged = await Task.Run(() => WaferReportWriter.WriteAll(issued, staging, stem), cancellationToken).ConfigureAwait(false);
            var files = new List<ReportManifestFile>();
            foreach (string path in (string[])[staged.HtmlPath, staged.PdfPath, staged.CsvPath, staged.JsonPath])
            {
                files.Add(new ReportManifestFile(Path.GetFileName(path), ReportHashes.OfFile(path), new FileInfo(path).Length));
            }
            string content = ReportHashes.ContentHash(files);
            var manifest = new ReportRevisionManifest
            {
                Wafer = request.Wafer,
                Revision = next,
                CreatedAt = report.Identity.GeneratedAt,
                Reason = request.Reason,
                Requester = request.Requester,
                SoftwareVersion = softwareVersion,
                ConfigSha256 = configSha,
                ModelId = request.ModelId,
                Inputs = request.Inputs,
                Files = files,
                ContentSha256 = content,
            };
            await File.WriteAllBytesAsync(Path.Combine(staging, ReportHashes.ListingFileName), ReportHashes.Listing(files), cancellationToken).ConfigureAwait(false);
            await File.WriteAllTextAsync(Path.Combine(staging, ReportHashes.ManifestFileName), ReportHashes.WriteManifest(manifest), cancellationToken).ConfigureAwait(false);
            MakeReadOnly(staging);
            try
            {
                Directory.Move(staging, target);
            }
            catch (IOException) when (Directory.Exists(target))
            {
                Directory.Delete(staging, recursive: true); // another writer took the number a moment ago
                continue;
            }
            ReportRevisionRecord? stored = await store.AddReportRevisionAsync(new ReportRevisionRecord
            {
                Wafer = request.Wafer,
                Revision = next,
                CreatedAt = report.Identity.GeneratedAt,
                Reason = request.Reason,
                Requester = request.Requester,
                SoftwareVersion = softwareVersion,
                ConfigSha256 = configSha,
                ConfigJson = request.ConfigJson,
                ModelId = request.ModelId,
                Inputs = request.Inputs,
                ContentSha256 = content,
                Folder = target,
                Verdict = request.Verdict,
                DigestJson = request.DigestJson,
            }, request.AnsweredRequestIds, cancellationToken).ConfigureAwait(false);
            if (stored is null)
            {
                // The store holds this number already (a daemon with another reports folder): keep our files aside, unlisted.
                Directory.Move(target, Path.Combine(request.Folder, ".unrecorded-r" + next.ToString(System.Globalization.CultureInfo.InvariantCulture) + "-" + Guid.NewGuid().ToString("N")));
                continue;
            }
            return (stored, new ReportFiles(
                Path.Combine(target, Path.GetFileName(staged.HtmlPath)),
                Path.Combine(target, Path.GetFileName(staged.PdfPath)),
                Path.Combine(target, Path.GetFileName(staged.CsvPath)),
                Path.Combine(target, Path.GetFileName(staged.JsonPath))));
        }
        throw new IOException($"no free report revision number for wafer {request.Wafer} after {Attempts} attempts");
    }

    /// <summary>Files of an issued revision are read-only (0444), so a careless edit needs a deliberate chmod first.</summary>
    private static void MakeReadOnly(string folder)
    {
        if (OperatingSystem.IsWindows())
        {
            return;
        }
        foreach (string file in Directory.EnumerateFiles(folder))
        {
            File.SetUnixFileMode(file, UnixFileMode.UserRead | UnixFileMode.GroupRead | UnixFileMode.OtherRead);
        }
    }
}
