namespace RunWatch.Wafers.Records;

/// <summary>What <see cref="ReportRevisionVerifier"/> found: mismatches (the report is not what was issued) and notes.</summary>
/// <param name="Wafer">Wafer of the revision, when the manifest could be read.</param>
/// <param name="Revision">Revision number, or 0.</param>
/// <param name="ContentSha256">The content hash recomputed from the files.</param>
/// <param name="Problems">Each mismatch in plain words; empty when the report verifies.</param>
/// <param name="Notes">What could not be checked (inputs gone, no store), in plain words.</param>
public sealed record ReportVerification(string? Wafer, int Revision, string? ContentSha256, IReadOnlyList<string> Problems, IReadOnlyList<string> Notes)
{
    public bool Verified => Problems.Count == 0;
}
