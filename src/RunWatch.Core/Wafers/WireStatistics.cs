namespace RunWatch.Core.Wafers;

/// <summary>Summary statistics of a wafer's wires.</summary>
/// <param name="Count">Wires measured.</param>
/// <param name="MeanRadiusNm">Mean radius (nm).</param>
/// <param name="RadiusSdNm">Sample SD of the radius (nm).</param>
/// <param name="RadiusCv">SD / mean.</param>
/// <param name="MedianRadiusNm">Median radius (nm).</param>
/// <param name="MinRadiusNm">Smallest radius (nm).</param>
/// <param name="MaxRadiusNm">Largest radius (nm).</param>
/// <param name="DensityPerCm2">Wires per cm² of analysed area.</param>
/// <param name="VerticalYield">Fraction of vertical wires.</param>
public sealed record WireStatistics(
    int Count,
    double MeanRadiusNm,
    double RadiusSdNm,
    double RadiusCv,
    double MedianRadiusNm,
    double MinRadiusNm,
    double MaxRadiusNm,
    double DensityPerCm2,
    double VerticalYield)
{
    /// <summary>Computes the statistics from the wire table and the total analysed area.</summary>
    /// <param name="wires">All wires (at least two).</param>
    /// <param name="analysedAreaCm2">Total analysed field area (cm²), &gt; 0.</param>
    public static WireStatistics From(IReadOnlyList<WireRow> wires, double analysedAreaCm2)
    {
        ArgumentNullException.ThrowIfNull(wires);
        if (wires.Count < 2)
        {
            throw new ArgumentException($"Statistics need at least 2 wires; got {wires.Count}.", nameof(wires));
        }
        if (!(analysedAreaCm2 > 0))
        {
            throw new ArgumentOutOfRangeException(nameof(analysedAreaCm2), "The analysed area must be positive.");
        }
        var radii = new double[wires.Count];
        int vertical = 0;
        double sum = 0;
        for (int i = 0; i < radii.Length; i++)
        {
            radii[i] = wires[i].RadiusNm;
            sum += radii[i];
            vertical += wires[i].Vertical ? 1 : 0;
        }
        double mean = sum / radii.Length;
        double ss = 0;
        foreach (double r in radii)
        {
            ss += (r - mean) * (r - mean);
        }
        double sd = Math.Sqrt(ss / (radii.Length - 1));
        Array.Sort(radii);
        int mid = radii.Length / 2;
        double median = radii.Length % 2 == 1 ? radii[mid] : (radii[mid - 1] + radii[mid]) / 2;
        return new WireStatistics(radii.Length, mean, sd, sd / mean, median, radii[0], radii[^1], radii.Length / analysedAreaCm2, vertical / (double)radii.Length);
    }
}
