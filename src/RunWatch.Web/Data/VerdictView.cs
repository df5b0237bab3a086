namespace RunWatch.Web.Data;

/// <summary>The QC verdict of a wafer and the reasons for it.</summary>
public sealed record VerdictView(VerdictOutcome Outcome, IReadOnlyList<string> Reasons, DateTimeOffset DecidedAt);
