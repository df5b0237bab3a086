namespace RunWatch.Storage;

/// <summary>A report file written for a wafer.</summary>
/// <param name="Id">Store id; 0 before it is stored.</param>
/// <param name="Wafer">Wafer name.</param>
/// <param name="CreatedAt">When it was written.</param>
/// <param name="Verdict">pass, warn or fail.</param>
/// <param name="Format">html, pdf, csv or json.</param>
/// <param name="FilePath">Where the file is.</param>
/// <param name="SummaryJson">Short summary as JSON.</param>
public sealed record WaferReportRecord(long Id, string Wafer, DateTimeOffset CreatedAt, string Verdict, string Format, string FilePath, string? SummaryJson);
