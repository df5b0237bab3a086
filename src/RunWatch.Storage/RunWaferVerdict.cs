namespace RunWatch.Storage;

/// <summary>The verdict of a wafer's newest report, with the run the wafer came from.</summary>
/// <param name="RunId">Store id of the wafer's run.</param>
/// <param name="Wafer">Wafer name.</param>
/// <param name="Verdict">Verdict as the report wrote it (pass, warn, fail).</param>
public sealed record RunWaferVerdict(long RunId, string Wafer, string Verdict);
