namespace RunWatch.Core.Geometry;

/// <summary>Which zones are flagged as guarded (left out of zone statistics) because wires the field does not show could change them.</summary>
public enum GuardRule
{
    /// <summary>
    /// The rule of the design notes: finite L — the disc of radius L leaves the field or reaches the excluded band;
    /// L = ∞ — the Voronoi cell reaches the field edge or the band. Cheap and conventional, but not airtight: a
    /// wire just outside the field can still cut a zone whose point lies between L and 2L from the edge.
    /// </summary>
    DiscCrossesEdge,

    /// <summary>
    /// Airtight: guarded unless the point is at least 2·R from the edge and the band, R being the largest distance
    /// from the point to its zone (at most L). An unseen wire q can cut the zone only if |q − p| &lt; 2R (DERIVED:
    /// a zone point z nearer q than p has |z − q| &lt; |z − p| ≤ R). Flags more zones than the design rule.
    /// </summary>
    UnseenNeighbourCouldCut,
}
