namespace RunWatch.Imaging.Measurement;

/// <summary>What the sub-pixel edge step found for one object (pixel units, image levels on the 16-bit scale).</summary>
internal struct EdgeProfile
{
    /// <summary>Rays whose half-maximum edge was located (of <see cref="EdgeRefiner.Rays"/>).</summary>
    public int ValidRays;

    /// <summary>Rays that ran into another object before reaching substrate (a touching neighbour or a cut).</summary>
    public int BlockedRays;

    /// <summary>½∮r²dφ over the located edge, before the blur correction, px².</summary>
    public double HalfLevelArea;

    /// <summary>Edge width σ of the object's mean edge profile (outer flank, 50 % → 16 % distance), px.</summary>
    public double EdgeSigma;

    /// <summary>Local substrate level beside the object.</summary>
    public double Substrate;

    /// <summary>Top level at the edge: the peak of the mean edge profile (rim included).</summary>
    public double Top;

    /// <summary>Median level in the inner 40 % of the object (a droplet raises it).</summary>
    public double Centre;

    /// <summary>Relative amplitude of the 2nd–5th angular harmonics of the edge radius: 0 for a hexagon or disc, larger for irregular outlines.</summary>
    public double Irregularity;

    /// <summary>Relative amplitude of the 6th angular harmonic of the edge radius: about 0.04 for a blurred hexagon, near 0 for a disc (a droplet).</summary>
    public double SixFold;

    /// <summary>Max/min of the located edge diameters over opposite ray pairs (NaN when too few pairs).</summary>
    public double RayAspect;

    /// <summary>Radius of a bright core (droplet) inside the object at half-way between the core and the top level, px; 0 when none.</summary>
    public double CoreRadius;
}
