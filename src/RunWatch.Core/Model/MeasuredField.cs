using RunWatch.Core.Geometry;

namespace RunWatch.Core.Model;

/// <summary>One measured SEM field: its rectangle and the wire centres found in it, both in nm.</summary>
/// <param name="Field">Field rectangle (with its excluded band, if any).</param>
/// <param name="WirePositionsNm">Wire centres in the order their radii are given.</param>
public sealed record MeasuredField(CaptureField Field, Point2D[] WirePositionsNm);
