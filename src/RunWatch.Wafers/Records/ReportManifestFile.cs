namespace RunWatch.Wafers.Records;

/// <summary>One file of a report revision with the SHA-256 of its bytes (lower-case hex) and its length.</summary>
public sealed record ReportManifestFile(string Name, string Sha256, long Bytes);
