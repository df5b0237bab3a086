namespace RunWatch.Web.Data.Fields;

/// <summary>A field for the full-field viewer: its latest analysis's wires and the wafer's compared wires.</summary>
/// <param name="FieldId">Field id.</param>
/// <param name="FileName">File, relative to the drop folder.</param>
/// <param name="WaferId">Wafer, when assigned.</param>
/// <param name="State">Queue state.</param>
/// <param name="Reason">Why it failed, waits or was refused.</param>
/// <param name="PixelSizeNm">Pixel size, nm; NaN before analysis.</param>
/// <param name="WidthPx">Image width, px; 0 before analysis.</param>
/// <param name="HeightPx">Image height, px; 0 before analysis.</param>
/// <param name="AnalysedHeightNm">Analysed height (above the excluded strip), nm.</param>
/// <param name="DiffusionLengthNm">L used for the capture zones, nm.</param>
/// <param name="Wires">The field's wires.</param>
/// <param name="WaferParity">Every compared wire of the wafer (this field's and the others').</param>
public sealed record FieldDetail(string FieldId, string FileName, string? WaferId, FieldQueueState State, string? Reason, double PixelSizeNm,
    int WidthPx, int HeightPx, double AnalysedHeightNm, double? DiffusionLengthNm, IReadOnlyList<FieldWireView> Wires, IReadOnlyList<ParityPoint> WaferParity);
