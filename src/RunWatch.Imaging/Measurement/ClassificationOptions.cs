namespace RunWatch.Imaging.Measurement;

/// <summary>Thresholds that sort segmented objects into <see cref="WireClass"/>es. Tried in the order elongated, oversized, irregular.</summary>
public sealed class ClassificationOptions
{
    /// <summary>Largest max/min Feret ratio of a vertical wire. A regular hexagon gives 2/√3 = 1.155.</summary>
    /// <value>1.45</value>
    public double MaxAspectRatio { get; init; } = 1.45;

    /// <summary>An object whose area exceeds this multiple of the field's median vertical-candidate area is oversized.</summary>
    /// <value>2.5</value>
    public double MaxAreaOverMedian { get; init; } = 2.5;

    /// <summary>Smallest solidity (area / convex hull area) of a vertical wire.</summary>
    /// <value>0.85</value>
    public double MinSolidity { get; init; } = 0.85;

    /// <summary>Smallest circularity 4πA/P² of a vertical wire; a regular hexagon gives 0.907, a disc 1.</summary>
    /// <value>0.7</value>
    public double MinCircularity { get; init; } = 0.7;

    /// <summary>Largest relative amplitude of the edge radius's 2nd–5th angular harmonics of a vertical wire (a hexagon has none); crystallites have more.</summary>
    /// <value>0.06</value>
    public double MaxIrregularity { get; init; } = 0.06;

    /// <summary>Range of a vertical wire's top contrast (edge peak − substrate) relative to the field's median; crystallites and debris differ.</summary>
    /// <value>0.72 … 1.4</value>
    public double MinRelativeContrast { get; init; } = 0.72;

    public double MaxRelativeContrast { get; init; } = 1.4;

    /// <summary>An object rounder than this (6th harmonic of the edge radius) and brighter than <see cref="MaxRelativeContrast"/> is a droplet hiding its facet; a blurred hexagon gives about 0.04.</summary>
    /// <value>0.02</value>
    public double MaxDropletSixFold { get; init; } = 0.02;

    public void Validate()
    {
        if (!(MaxAspectRatio >= 1))
        {
            throw new ArgumentOutOfRangeException(nameof(MaxAspectRatio), MaxAspectRatio, "must be at least 1");
        }
        if (!(MaxAreaOverMedian > 1))
        {
            throw new ArgumentOutOfRangeException(nameof(MaxAreaOverMedian), MaxAreaOverMedian, "must exceed 1");
        }
        if (!(MinSolidity is > 0 and <= 1))
        {
            throw new ArgumentOutOfRangeException(nameof(MinSolidity), MinSolidity, "must lie in (0, 1]");
        }
        if (!(MinCircularity is > 0 and <= 1.2))
        {
            throw new ArgumentOutOfRangeException(nameof(MinCircularity), MinCircularity, "must lie in (0, 1.2]");
        }
    }
}
