namespace RunWatch.Reports.Json;

/// <summary>One field in a report summary.</summary>
public sealed record FieldFigures(string FieldName, int WireCount, string Caption);
