namespace RunWatch.Core.Wafers;

/// <summary>One measured wire.</summary>
/// <param name="FieldName">Field the wire was measured in.</param>
/// <param name="WireId">Wire number within the field.</param>
/// <param name="XNm">Centre x on the field (nm).</param>
/// <param name="YNm">Centre y on the field (nm).</param>
/// <param name="RadiusNm">Measured radius (nm).</param>
/// <param name="NormalisedArea">Normalised capture area Â, or NaN when the wire is in the guard zone.</param>
/// <param name="PredictedRadiusNm">Radius predicted from Â by the model, or NaN.</param>
/// <param name="Vertical">Whether the wire was classed as vertical.</param>
public sealed record WireRow(string FieldName, int WireId, double XNm, double YNm, double RadiusNm, double NormalisedArea, double PredictedRadiusNm, bool Vertical);
