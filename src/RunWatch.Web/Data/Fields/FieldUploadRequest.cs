namespace RunWatch.Web.Data.Fields;

/// <summary>
/// An SEM image uploaded in the browser with the sidecar fields entered in the form, or the text of a sidecar file
/// (<c>runwatch-field/1</c>, docs/imaging.md). Not both: the form refuses the mix rather than guess which wins.
/// </summary>
/// <param name="FileName">The image's file name (it may carry the wafer id, as in the drop folder).</param>
/// <param name="WaferId">Wafer id, when not in the file name.</param>
/// <param name="PixelSizeNm">Pixel size, nm.</param>
/// <param name="PositionXMm">Field position on the wafer, mm.</param>
/// <param name="PositionYMm">Field position on the wafer, mm.</param>
/// <param name="TiltDeg">Stage tilt, degrees.</param>
/// <param name="ExcludedBottomRows">Rows of the instrument's information strip.</param>
/// <param name="SidecarText">The sidecar file's text, or null.</param>
public sealed record FieldUploadRequest(string FileName, string? WaferId = null, double? PixelSizeNm = null, double? PositionXMm = null,
    double? PositionYMm = null, double? TiltDeg = null, int? ExcludedBottomRows = null, string? SidecarText = null)
{
    /// <summary>Whether any sidecar field was entered in the form.</summary>
    public bool HasFormFields => !string.IsNullOrWhiteSpace(WaferId) || PixelSizeNm is not null || PositionXMm is not null
        || PositionYMm is not null || TiltDeg is not null || ExcludedBottomRows is not null;
}
