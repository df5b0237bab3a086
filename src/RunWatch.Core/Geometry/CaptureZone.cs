namespace RunWatch.Core.Geometry;

/// <summary>One point's capture zone.</summary>
/// <param name="Index">The point's index in the input.</param>
/// <param name="Area">Zone area in the points' unit squared (µm² or px²).</param>
/// <param name="NormalisedArea">Â = area / (π·L²); NaN when L is infinite.</param>
/// <param name="Guarded">True when the zone may be cut by wires the field does not show (guard-zone rule): leave it out of statistics.</param>
public readonly record struct CaptureZone(int Index, double Area, double NormalisedArea, bool Guarded);
