namespace RunWatch.Web.Data.Fields;

/// <summary>One wire of the wafer in the predicted-against-measured chart, with the field it belongs to.</summary>
public sealed record ParityPoint(string FieldId, int WireId, double PredictedRadiusNm, double MeasuredRadiusNm);
