namespace RunWatch.Core.Wafers;

/// <summary>
/// The wafer outline a map is drawn on. The store does not record a wafer's size, so the map uses the smallest
/// standard diameter (SEMI sizes 2″, 3″, 100, 150, 200, 300 mm: COMMON PRACTICE) that holds every field position.
/// </summary>
public static class WaferOutline
{
    /// <summary>Standard wafer diameters, mm, ascending.</summary>
    public static IReadOnlyList<double> StandardDiametersMm { get; } = [50.8, 76.2, 100, 150, 200, 300];

    /// <summary>The smallest standard diameter whose radius is at least <paramref name="farthestFieldMm"/>; the largest when none is.</summary>
    public static double DiameterHoldingMm(double farthestFieldMm)
    {
        foreach (double d in StandardDiametersMm)
        {
            if (d / 2 >= farthestFieldMm)
            {
                return d;
            }
        }
        return Math.Max(StandardDiametersMm[^1], 2 * farthestFieldMm);
    }
}
