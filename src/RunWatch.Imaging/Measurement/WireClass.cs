namespace RunWatch.Imaging.Measurement;

/// <summary>What a segmented object is taken to be.</summary>
public enum WireClass
{
    /// <summary>A vertical wire seen end-on: compact, near-round or hexagonal.</summary>
    Vertical,

    /// <summary>Elongated: a tilted or inclined wire seen side-on (aspect ratio above the limit).</summary>
    Elongated,

    /// <summary>Much larger than the field's typical wire: a parasitic cluster or merged growth.</summary>
    Oversized,

    /// <summary>Compact in extent but irregular in outline: kinked, branched or parasitic.</summary>
    Irregular,
}
