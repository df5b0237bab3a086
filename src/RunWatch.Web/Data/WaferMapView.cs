using RunWatch.Core.Wafers;

namespace RunWatch.Web.Data;

/// <summary>A wafer's map: the outline used, every field, and the across-wafer uniformity of the field mean radii.</summary>
public sealed record WaferMapView(string WaferId, string RunId, string Process, string? Verdict, double OutlineDiameterMm, IReadOnlyList<FieldMapPoint> Fields, WaferUniformity Uniformity);
