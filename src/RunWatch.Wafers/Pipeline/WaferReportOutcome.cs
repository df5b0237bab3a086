using RunWatch.Core.Qc;
using RunWatch.Storage;

namespace RunWatch.Wafers.Pipeline;

/// <summary>What writing a wafer's report produced.</summary>
/// <param name="Wafer">Wafer id.</param>
/// <param name="Verdict">pass, warn or fail with reasons.</param>
/// <param name="Folder">Folder holding the files (the revision's folder).</param>
/// <param name="Files">Format → file path (html, pdf, csv, json).</param>
public sealed record WaferReportOutcome(string Wafer, QcVerdict Verdict, string Folder, IReadOnlyDictionary<string, string> Files)
{
    /// <summary>The stored revision these files are.</summary>
    public ReportRevisionRecord? Revision { get; init; }
}
