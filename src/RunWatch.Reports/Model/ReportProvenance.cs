namespace RunWatch.Reports.Model;

/// <summary>
/// What makes a report a record: its revision number, why and for whom it was written, and what it was made from
/// (configuration and specification hash, model, input images with their SHA-256). Shown in every format.
/// </summary>
/// <param name="Revision">1 for the first issue, then 2, 3, ….</param>
/// <param name="Reason">Why this revision was written.</param>
/// <param name="Requester">Who asked (a user, "intake", or the command line's user).</param>
/// <param name="ConfigSha256">SHA-256 of the configuration and QC specification in force (canonical JSON).</param>
/// <param name="ModelId">The radius model used.</param>
/// <param name="Inputs">Input images and their SHA-256.</param>
public sealed record ReportProvenance(int Revision, string Reason, string Requester, string ConfigSha256, string ModelId, IReadOnlyList<ReportInputFile> Inputs);
