namespace RunWatch.Web.Data;

/// <summary>A QC specification limit, editable by admins.</summary>
public sealed record SpecEntry(string Name, double? Min, double? Max, string Unit);
