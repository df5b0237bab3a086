namespace RunWatch.Web.Data;

/// <summary>One SEM image (field) of a wafer.</summary>
public sealed record FieldView(string FieldId, string FileName, DateTimeOffset AcquiredAt, double PixelSizeNm, int WireCount);
