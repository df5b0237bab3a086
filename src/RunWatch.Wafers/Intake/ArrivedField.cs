namespace RunWatch.Wafers.Intake;

/// <summary>An SEM image that has stopped growing in the drop folder and passed the name checks.</summary>
/// <param name="FullPath">Absolute path of the image.</param>
/// <param name="RelativePath">Path relative to the drop folder, as shown to people.</param>
/// <param name="SizeBytes">File size when it was found stable.</param>
/// <param name="LastWriteUtc">Last-write time when it was found stable.</param>
public sealed record ArrivedField(string FullPath, string RelativePath, long SizeBytes, DateTimeOffset LastWriteUtc);
