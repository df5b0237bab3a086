namespace RunWatch.Imaging.Measurement;

/// <summary>
/// One wire (or other object) found in a field. Lengths are in <see cref="Analysis.FieldAnalysis.LengthUnit"/>
/// (nm with a scale, else px), areas in its square. Coordinates: the image spans [0, width] × [0, height] with
/// y down; pixel (x, y) covers [x, x+1) × [y, y+1).
/// </summary>
public sealed record WireMeasurement
{
    /// <summary>Label in the field's label image (1-based).</summary>
    public required int Id { get; init; }

    public required double AreaPixels { get; init; }

    public required double Area { get; init; }

    /// <summary>
    /// The wire's radius, √(facet area/π): at the sub-pixel edge when <see cref="RadiusMethod"/> is "edge", from the
    /// droplet and the process contact angle when "droplet", from the threshold outline when "threshold"; NaN when only a
    /// droplet was seen and no contact angle is set. Corrected for stage tilt.
    /// </summary>
    public required double EquivalentRadius { get; init; }

    /// <summary>√(pixel count/π) of the threshold outline (the detector's own figure).</summary>
    public double ThresholdRadius { get; init; }

    /// <summary>"edge", "droplet" or "threshold": how <see cref="EquivalentRadius"/> was measured.</summary>
    public string RadiusMethod { get; init; } = "threshold";

    /// <summary>Radius of the catalyst droplet seen from the top, or null when none was found.</summary>
    public double? DropletRadius { get; init; }

    /// <summary>Relative amplitude of the edge radius's 2nd–5th angular harmonics (NaN when too few edge rays).</summary>
    public double Irregularity { get; init; } = double.NaN;

    /// <summary>Top contrast (edge peak − local substrate) relative to the field's median; NaN without edges.</summary>
    public double RelativeContrast { get; init; } = double.NaN;

    public required double CentroidX { get; init; }

    public required double CentroidY { get; init; }

    public required double MinFeret { get; init; }

    public required double MaxFeret { get; init; }

    /// <summary>4πA/P², P estimated from the boundary crack length × π/4.</summary>
    public required double Circularity { get; init; }

    /// <summary>Max Feret / min Feret.</summary>
    public required double AspectRatio { get; init; }

    /// <summary>Area / convex hull area.</summary>
    public required double Solidity { get; init; }

    /// <summary>Mean of the decoded image over the wire, on the 16-bit scale.</summary>
    public required double MeanIntensity { get; init; }

    public required WireClass Class { get; init; }

    /// <summary>Touches the image edge or the excluded band: measured but left out of the statistics.</summary>
    public required bool TouchesBorder { get; init; }

    /// <summary>Split off a cluster of touching wires by the watershed.</summary>
    public required bool Split { get; init; }

    /// <summary>Edge-based capture zone area (substrate within L of this wire's boundary and nearer to it than to any other wire), or null without L.</summary>
    public double? EdgeZoneArea { get; init; }

    /// <summary>Edge-based zone area / (πL²).</summary>
    public double? EdgeZoneNormalized { get; init; }

    /// <summary>Centroid-based capture zone area (Voronoi cell ∩ disc of radius L), or null.</summary>
    public double? CentroidZoneArea { get; init; }

    /// <summary>Centroid-based zone area / (πL²).</summary>
    public double? CentroidZoneNormalized { get; init; }

    /// <summary>Kept out of zone statistics: the disc of radius L crosses the image edge or the excluded band (guard zone).</summary>
    public bool? ZoneGuarded { get; init; }

    /// <summary>Distance from the centroid to the nearest other wire's centroid, or null.</summary>
    public double? NearestNeighbourDistance { get; init; }
}
