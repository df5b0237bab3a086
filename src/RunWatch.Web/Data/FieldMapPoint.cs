using RunWatch.Core.Wafers;

namespace RunWatch.Web.Data;

/// <summary>One field of the wafer map: its stored position (null when the sidecar gave none), figures and field verdict.</summary>
public sealed record FieldMapPoint(string FieldId, string FileName, double? XMm, double? YMm, FieldFigures? Figures, VerdictOutcome? Verdict, IReadOnlyList<string> Reasons)
{
    /// <summary>Distance from the wafer centre, mm; NaN without a position.</summary>
    public double DistanceMm => XMm is { } x && YMm is { } y ? WaferUniformity.DistanceFromCentreMm(x, y) : double.NaN;
}
