namespace RunWatch.Reports.Model;

/// <summary>Who and what a wafer report is about. Every string may come from outside and is escaped on output.</summary>
/// <param name="WaferId">Wafer id.</param>
/// <param name="RunId">Run id.</param>
/// <param name="Recipe">Recipe name.</param>
/// <param name="Chamber">Chamber name.</param>
/// <param name="RunStart">Run start (the thermal series' time origin).</param>
/// <param name="RunEnd">Run end, or null when the run has not ended.</param>
/// <param name="GeneratedAt">When the report was written.</param>
/// <param name="SoftwareVersion">RunWatch version that wrote it.</param>
/// <param name="DataLabel">A label shown in the header, for example "invented demo data"; empty for production data.</param>
/// <param name="Notes">Operator notes attached to the run or wafer.</param>
public sealed record ReportIdentity(
    string WaferId,
    string RunId,
    string Recipe,
    string Chamber,
    DateTimeOffset RunStart,
    DateTimeOffset? RunEnd,
    DateTimeOffset GeneratedAt,
    string SoftwareVersion,
    string DataLabel,
    IReadOnlyList<string> Notes)
{
    /// <summary>
    /// IANA or Windows id of the lab's time zone: every time in the report is shown in it with its UTC offset, the
    /// dashboard's convention (RunWatch:Dashboard:TimeZone). Null or empty means the machine's local zone.
    /// </summary>
    public string? TimeZoneId { get; init; }
}
