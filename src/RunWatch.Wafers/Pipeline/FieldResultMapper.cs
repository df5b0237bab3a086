using RunWatch.Core.Wafers;
using RunWatch.Imaging.Analysis;
using RunWatch.Imaging.Measurement;

namespace RunWatch.Wafers.Pipeline;

/// <summary>Turns an image analysis into the record the wafer pipeline keeps.</summary>
internal static class FieldResultMapper
{
    /// <summary>Maps <paramref name="analysis"/>; throws when the field has no scale (radii in pixels cannot enter a wafer verdict).</summary>
    public static FieldResult From(FieldAnalysis analysis)
    {
        ArgumentNullException.ThrowIfNull(analysis);
        if (analysis.Scale.PixelSizeNm is not { } nmPerPx)
        {
            throw new InvalidOperationException(
                $"{analysis.Source}: no pixel size (no sidecar, no configured value, no TIFF resolution tags); results would be in pixels and cannot be judged against a radius specification");
        }
        var wires = new List<FieldWire>(analysis.Wires.Count);
        foreach (WireMeasurement w in analysis.Wires)
        {
            wires.Add(new FieldWire(
                w.Id,
                w.CentroidX,
                w.CentroidY,
                w.EquivalentRadius,
                w.Class == WireClass.Vertical,
                !w.TouchesBorder,
                w.ZoneGuarded == false ? w.CentroidZoneNormalized : null,
                w.DropletRadius));
        }
        double analysedHeightPx = analysis.Height - analysis.ExcludedBottomRows - analysis.ExcludedTopRows;
        double areaCm2 = analysis.Width * nmPerPx * analysedHeightPx * nmPerPx * 1e-14;
        return new FieldResult
        {
            FieldName = analysis.Source,
            PixelSizeNm = nmPerPx,
            WidthNm = analysis.Width * nmPerPx,
            AnalysedHeightNm = analysedHeightPx * nmPerPx,
            Threshold = $"{analysis.Threshold} ({analysis.ThresholdMethod})",
            AnalysedAreaCm2 = areaCm2,
            DensityPerCm2 = analysis.Statistics.DensityPerCm2,
            VerticalYield = analysis.Statistics.VerticalYield,
            DiffusionLengthNm = analysis.Statistics.DiffusionLength,
            ClarkEvansR = analysis.Statistics.ClarkEvansR,
            PositionXMm = analysis.FieldPosition?.XMm,
            PositionYMm = analysis.FieldPosition?.YMm,
            Notes = analysis.Notes,
            Wires = wires,
        };
    }
}
