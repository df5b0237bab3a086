namespace RunWatch.Imaging.Decoding;

/// <summary>
/// Resolution read from the standard TIFF tags XResolution (282), YResolution (283) and ResolutionUnit (296)
/// (TIFF 6.0, section 8): pixels per <see cref="Unit"/>.
/// </summary>
/// <param name="XPixelsPerUnit">XResolution.</param>
/// <param name="YPixelsPerUnit">YResolution.</param>
/// <param name="Unit">1 = no absolute unit, 2 = inch, 3 = centimetre (TIFF 6.0).</param>
public readonly record struct EmbeddedResolution(double XPixelsPerUnit, double YPixelsPerUnit, int Unit)
{
    /// <summary>Pixel size along x in nanometres, or null when the unit is not absolute or the value is not positive.</summary>
    public double? XPixelSizeNm => ToNm(XPixelsPerUnit);

    /// <summary>Pixel size along y in nanometres, or null when the unit is not absolute or the value is not positive.</summary>
    public double? YPixelSizeNm => ToNm(YPixelsPerUnit);

    private double? ToNm(double pixelsPerUnit)
    {
        if (!(pixelsPerUnit > 0) || double.IsInfinity(pixelsPerUnit))
        {
            return null;
        }
        return Unit switch
        {
            2 => 25.4e6 / pixelsPerUnit,
            3 => 1e7 / pixelsPerUnit,
            _ => null,
        };
    }
}
