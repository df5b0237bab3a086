namespace RunWatch.Storage;

/// <summary>One input of a report revision: a SEM field and the SHA-256 of its image file's bytes.</summary>
/// <param name="FieldId">Store id of the field.</param>
/// <param name="File">The field's path relative to the drop folder (as taken in).</param>
/// <param name="Path">Where the image was read from (full path; it may have moved or gone since).</param>
/// <param name="Sha256">SHA-256 of the image file, lower-case hex.</param>
public sealed record ReportInputHash(long FieldId, string File, string Path, string Sha256);
