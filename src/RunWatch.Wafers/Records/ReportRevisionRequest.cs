using RunWatch.Reports.Model;
using RunWatch.Storage;

namespace RunWatch.Wafers.Records;

/// <summary>Everything a new revision records besides the report itself.</summary>
/// <param name="Wafer">Wafer id.</param>
/// <param name="Folder">The wafer's report folder; revisions go into r1, r2, … below it.</param>
/// <param name="Reason">Why it is written.</param>
/// <param name="Requester">Who asked.</param>
/// <param name="ConfigJson">Configuration and specification in force, canonical JSON.</param>
/// <param name="ModelId">The radius model used.</param>
/// <param name="Inputs">Input images with their SHA-256.</param>
/// <param name="Verdict">pass, warn or fail.</param>
/// <param name="DigestJson">What the screens compare between revisions.</param>
/// <param name="AnsweredRequestIds">Stored requests this revision answers.</param>
public sealed record ReportRevisionRequest(
    string Wafer,
    string Folder,
    string Reason,
    string Requester,
    string ConfigJson,
    string ModelId,
    IReadOnlyList<ReportInputHash> Inputs,
    string Verdict,
    string DigestJson,
    IReadOnlyList<long> AnsweredRequestIds);
