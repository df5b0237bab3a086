using RunWatch.Core.Geometry;
using RunWatch.Core.Wafers;

namespace RunWatch.Testing.Physics;

/// <summary>A <see cref="GrowthTruth"/> wafer as the wafer pipeline stores a measured field (lengths in nm, every object a vertical interior wire).</summary>
public static class GrowthTruthFields
{
    public static FieldResult ToField(string name, (Point2D[] Centres, double[] RadiiNm, CaptureField Field) wafer)
    {
        var wires = new List<FieldWire>(wafer.Centres.Length);
        for (int i = 0; i < wafer.Centres.Length; i++)
        {
            wires.Add(new FieldWire(i + 1, wafer.Centres[i].X * 1000, wafer.Centres[i].Y * 1000, wafer.RadiiNm[i], Vertical: true, Interior: true, ZoneNormalised: null));
        }
        double widthNm = wafer.Field.Width * 1000, heightNm = wafer.Field.Height * 1000;
        return new FieldResult
        {
            FieldName = name,
            PixelSizeNm = 10,
            WidthNm = widthNm,
            AnalysedHeightNm = heightNm,
            Threshold = "invented",
            AnalysedAreaCm2 = widthNm * heightNm * 1e-14,
            DensityPerCm2 = wafer.Centres.Length / (widthNm * heightNm * 1e-14),
            VerticalYield = 1,
            Wires = wires,
        };
    }
}
