using RunWatch.Storage;

namespace RunWatch.Wafers.Records;

/// <summary>
/// <c>revision.json</c> in a revision's folder: what the revision is, what it was made from, its files with their
/// SHA-256 and the content hash (the SHA-256 of <c>content.sha256</c>, the files' listing in sha256sum's format).
/// </summary>
public sealed record ReportRevisionManifest
{
    public int Schema { get; init; } = 1;

    public required string Wafer { get; init; }

    public required int Revision { get; init; }

    public required DateTimeOffset CreatedAt { get; init; }

    public required string Reason { get; init; }

    public required string Requester { get; init; }

    public required string SoftwareVersion { get; init; }

    public required string ConfigSha256 { get; init; }

    public required string ModelId { get; init; }

    public required IReadOnlyList<ReportInputHash> Inputs { get; init; }

    /// <summary>The report files in listing order (HTML, PDF, CSV, JSON).</summary>
    public required IReadOnlyList<ReportManifestFile> Files { get; init; }

    public required string ContentSha256 { get; init; }
}
