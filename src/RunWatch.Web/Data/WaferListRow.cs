namespace RunWatch.Web.Data;

/// <summary>A wafer as the wafer list shows it. <c>Date</c> is the start of its run, or when the store first heard of the wafer.</summary>
public sealed record WaferListRow(string WaferId, string RunId, string Chamber, string Process, string? Verdict, DateTimeOffset Date, double MeanRadiusNm, int Fields);
