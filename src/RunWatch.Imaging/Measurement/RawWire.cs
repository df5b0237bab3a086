namespace RunWatch.Imaging.Measurement;

/// <summary>Pixel-unit measurements of one segmented wire, before scaling and classification.</summary>
internal struct RawWire
{
    public int Label;
    public int Area;
    /// <summary>Centroid in image coordinates where pixel (x, y) covers [x, x+1) × [y, y+1).</summary>
    public double CentroidX;
    public double CentroidY;
    public double MeanIntensity;
    /// <summary>Boundary crack length × π/4 (see docs/imaging.md).</summary>
    public double Perimeter;
    public double MinFeret;
    public double MaxFeret;
    public double HullArea;
    public int MinX;
    public int MinY;
    public int MaxX;
    public int MaxY;
    /// <summary>True when the wire was split off a larger touching cluster.</summary>
    public bool FromSplit;
}
