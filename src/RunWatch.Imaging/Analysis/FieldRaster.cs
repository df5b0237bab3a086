using RunWatch.Imaging.Decoding;

namespace RunWatch.Imaging.Analysis;

/// <summary>The rasters behind a <see cref="FieldAnalysis"/>, for overlays: the decoded image, the wire label image and, when kept, the zone map.</summary>
public sealed class FieldRaster(GrayImage image, int[] labels, int[]? zoneMap, int validHeight)
{
    public GrayImage Image { get; } = image;

    /// <summary>Wire id per pixel (0 = substrate), matching <see cref="Measurement.WireMeasurement.Id"/>.</summary>
    public int[] Labels { get; } = labels;

    /// <summary>Edge-based zone owner per pixel (wire id, 0 = beyond L), or null.</summary>
    public int[]? ZoneMap { get; } = zoneMap;

    /// <summary>Rows above the excluded band.</summary>
    public int ValidHeight { get; } = validHeight;
}
