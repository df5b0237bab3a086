namespace RunWatch.Imaging.Scale;

/// <summary>A field's pixel size and where it came from. Without a scale, lengths stay in pixels.</summary>
/// <param name="PixelSizeNm">Pixel edge length in nanometres, or null for no scale.</param>
/// <param name="Source">Where it came from.</param>
/// <param name="Note">Why a candidate was passed over, or a caution; empty when there is nothing to say.</param>
public sealed record FieldScale(double? PixelSizeNm, ScaleSource Source, string Note = "")
{
    /// <summary>True when lengths are in nanometres.</summary>
    public bool HasScale => PixelSizeNm is not null;

    /// <summary>The unit of reported lengths: "nm" or "px".</summary>
    public string LengthUnit => HasScale ? "nm" : "px";

    /// <summary>No scale.</summary>
    public static FieldScale None(string note = "") => new(null, ScaleSource.None, note);
}
