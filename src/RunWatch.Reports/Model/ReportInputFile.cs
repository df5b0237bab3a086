namespace RunWatch.Reports.Model;

/// <summary>An input image of a report and the SHA-256 of its bytes (lower-case hex).</summary>
public sealed record ReportInputFile(string Name, string Sha256);
