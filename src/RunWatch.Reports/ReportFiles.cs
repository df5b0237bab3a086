namespace RunWatch.Reports;

/// <summary>Paths of the files written for one wafer report.</summary>
public sealed record ReportFiles(string HtmlPath, string PdfPath, string CsvPath, string JsonPath);
