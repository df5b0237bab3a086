namespace RunWatch.Core.Geometry;

/// <summary>A point in the substrate plane, in the caller's length unit (µm or px; the same unit throughout a call).</summary>
/// <param name="X">Horizontal coordinate.</param>
/// <param name="Y">Vertical coordinate (image rows grow downwards; the geometry does not care).</param>
public readonly record struct Point2D(double X, double Y);
