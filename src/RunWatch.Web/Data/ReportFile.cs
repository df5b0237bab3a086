namespace RunWatch.Web.Data;

/// <summary>A report ready for download.</summary>
public sealed record ReportFile(string FileName, string ContentType, byte[] Content);
