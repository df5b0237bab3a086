using RunWatch.Imaging.Decoding;

namespace RunWatch.Imaging.Scale;

/// <summary>
/// Chooses a field's pixel size: the sidecar first, then the value given on the command line or in config,
/// then the standard TIFF resolution tags. Instrument-private tags are never read.
/// </summary>
public static class ScaleResolver
{
    /// <summary>
    /// Resolution tags that give a pixel outside this band (0.01 nm .. 100 µm) are taken as a writer's default
    /// (72 or 96 dpi is 353 or 265 µm) rather than an SEM scale.
    /// </summary>
    public const double MinPlausibleNm = 0.01;

    public const double MaxPlausibleNm = 100_000;

    public static FieldScale Resolve(FieldSidecar? sidecar, double? givenPixelSizeNm, EmbeddedResolution? resolution)
    {
        if (sidecar?.PixelSizeNm is { } fromSidecar)
        {
            return new FieldScale(fromSidecar, ScaleSource.Sidecar);
        }
        if (givenPixelSizeNm is { } given)
        {
            if (!(given > 0 && double.IsFinite(given)))
            {
                throw new ArgumentOutOfRangeException(nameof(givenPixelSizeNm), given, "pixel size must be a positive number of nanometres");
            }
            return new FieldScale(given, ScaleSource.Given);
        }
        if (resolution is { } r)
        {
            if (r.XPixelSizeNm is not { } x || r.YPixelSizeNm is not { } y)
            {
                return FieldScale.None($"TIFF resolution tags have no absolute unit (ResolutionUnit {r.Unit}); lengths are in pixels");
            }
            if (x < MinPlausibleNm || x > MaxPlausibleNm)
            {
                return FieldScale.None($"TIFF resolution {r.XPixelsPerUnit:G6} per {(r.Unit == 2 ? "inch" : "cm")} gives {x / 1000:G4} µm per pixel, not an SEM scale; lengths are in pixels");
            }
            string note = Math.Abs(x - y) > 0.01 * x
                ? $"x and y resolution differ ({x:G5} vs {y:G5} nm); the x value is used"
                : "";
            return new FieldScale(x, ScaleSource.TiffResolution, note);
        }
        return FieldScale.None("no sidecar, no given pixel size and no TIFF resolution tags: lengths are in pixels");
    }
}
