namespace RunWatch.Storage;

/// <summary>
/// One issue of a wafer's report: a numbered revision whose files are never overwritten, with what it was made
/// from (software, configuration and specification, model, input images) and the hash of its own content.
/// </summary>
public sealed record ReportRevisionRecord
{
    /// <summary>Store id; 0 before it is stored.</summary>
    public long Id { get; init; }

    public required string Wafer { get; init; }

    /// <summary>1 for the first issue, then 2, 3, … per wafer.</summary>
    public required int Revision { get; init; }

    public required DateTimeOffset CreatedAt { get; init; }

    /// <summary>Why this revision was written ("first issue", "re-analysis requested", "new field …").</summary>
    public required string Reason { get; init; }

    /// <summary>Who asked: a dashboard user, "intake" for a new field, or the command line's user.</summary>
    public required string Requester { get; init; }

    public required string SoftwareVersion { get; init; }

    /// <summary>SHA-256 (hex) of <see cref="ConfigJson"/>.</summary>
    public required string ConfigSha256 { get; init; }

    /// <summary>The configuration and QC specification in force, as canonical JSON.</summary>
    public required string ConfigJson { get; init; }

    /// <summary>The radius model used ("radius fit #12", or what stood in for it).</summary>
    public required string ModelId { get; init; }

    public required IReadOnlyList<ReportInputHash> Inputs { get; init; }

    /// <summary>SHA-256 (hex) of the revision's content listing (<c>content.sha256</c> in its folder).</summary>
    public required string ContentSha256 { get; init; }

    /// <summary>Folder holding the revision's files.</summary>
    public required string Folder { get; init; }

    /// <summary>pass, warn or fail.</summary>
    public required string Verdict { get; init; }

    /// <summary>What the screens compare between revisions (<see cref="WaferReportDigestJson"/>).</summary>
    public required string DigestJson { get; init; }
}
