namespace RunWatch.Core.Wafers;

/// <summary>
/// The figures of one SEM field, computed the way the wafer's own statistics are: mean radius, SD and CV over the
/// wires that count (<see cref="WaferEvaluator.Counts"/>), density over every object found per analysed area, and
/// vertical yield over the interior objects. A field with fewer than two counted wires has NaN radius figures.
/// </summary>
/// <param name="CountedWires">Wires that enter the radius statistics.</param>
/// <param name="MeanRadiusNm">Mean radius of the counted wires, nm.</param>
/// <param name="RadiusSdNm">Sample SD of their radius, nm.</param>
/// <param name="RadiusCv">SD / mean (fraction).</param>
/// <param name="DensityPerCm2">Objects found per cm² of analysed area; NaN when the area is not positive.</param>
/// <param name="VerticalYield">Vertical fraction of interior objects; NaN when none is interior.</param>
public sealed record FieldFigures(int CountedWires, double MeanRadiusNm, double RadiusSdNm, double RadiusCv, double DensityPerCm2, double VerticalYield)
{
    /// <summary>Figures of one analysed field.</summary>
    public static FieldFigures From(FieldResult field)
    {
        ArgumentNullException.ThrowIfNull(field);
        int counted = 0;
        int interior = 0;
        int vertical = 0;
        double sum = 0;
        foreach (FieldWire w in field.Wires)
        {
            if (w.Interior)
            {
                interior++;
                vertical += w.Vertical ? 1 : 0;
            }
            if (WaferEvaluator.Counts(w))
            {
                counted++;
                sum += w.RadiusNm;
            }
        }
        double mean = counted >= 2 ? sum / counted : double.NaN;
        double ss = 0;
        if (counted >= 2)
        {
            // Two passes (mean, then squared deviations): exact enough for a few thousand radii of similar size.
            foreach (FieldWire w in field.Wires)
            {
                if (WaferEvaluator.Counts(w))
                {
                    ss += (w.RadiusNm - mean) * (w.RadiusNm - mean);
                }
            }
        }
        double sd = counted >= 2 ? Math.Sqrt(ss / (counted - 1)) : double.NaN;
        double density = field.AnalysedAreaCm2 > 0 ? field.Wires.Count / field.AnalysedAreaCm2 : double.NaN;
        double yield = interior > 0 ? vertical / (double)interior : double.NaN;
        return new FieldFigures(counted, mean, sd, sd / mean, density, yield);
    }
}
