namespace RunWatch.Core.Wafers;

/// <summary>One wire of a field as the wafer pipeline keeps it (lengths in nm, image coordinates, y down).</summary>
/// <param name="Id">Label in the field.</param>
/// <param name="XNm">Centroid x.</param>
/// <param name="YNm">Centroid y.</param>
/// <param name="RadiusNm">Wire (facet) radius, equivalent circle; NaN when only a droplet was seen and no contact angle is set.</param>
/// <param name="Vertical">Classified as a vertical wire.</param>
/// <param name="Interior">Does not touch the image edge or the excluded band.</param>
/// <param name="ZoneNormalised">Centroid-based capture area / (πL²) at the run's L, when unguarded.</param>
/// <param name="DropletRadiusNm">Radius of the catalyst droplet seen from the top, when one was found.</param>
public sealed record FieldWire(int Id, double XNm, double YNm, double RadiusNm, bool Vertical, bool Interior, double? ZoneNormalised, double? DropletRadiusNm = null);
