namespace RunWatch.Web.Data;

/// <summary>An SEM field that could not be matched to a wafer automatically.</summary>
public sealed record UnmatchedField(string FieldId, string FileName, DateTimeOffset AcquiredAt, string Reason);
