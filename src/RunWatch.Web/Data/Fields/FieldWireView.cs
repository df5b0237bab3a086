namespace RunWatch.Web.Data.Fields;

/// <summary>
/// One wire of a field as the viewer draws it (nm, image coordinates from the top-left corner, y down) with the
/// radius the model predicted for it from the wafer's report, when the wire was compared.
/// </summary>
/// <param name="Id">Label in the field.</param>
/// <param name="XNm">Centroid x.</param>
/// <param name="YNm">Centroid y.</param>
/// <param name="RadiusNm">Measured radius (equivalent circle).</param>
/// <param name="Vertical">Classified vertical.</param>
/// <param name="Interior">Clear of the image edge and the excluded strip.</param>
/// <param name="NormalisedArea">Capture area / (π·L²) when the zone is unguarded; null when guarded or not computed.</param>
/// <param name="PredictedRadiusNm">Predicted radius from the wafer's report; null when not compared.</param>
public sealed record FieldWireView(int Id, double XNm, double YNm, double RadiusNm, bool Vertical, bool Interior, double? NormalisedArea, double? PredictedRadiusNm)
{
    /// <summary>Guarded: the wire's disc of radius L crosses the field's edge or the excluded strip, so its zone is cut and it is not counted.</summary>
    public bool Guarded => NormalisedArea is null;
}
