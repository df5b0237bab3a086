namespace RunWatch.Core.Wafers;

/// <summary>
/// Wire (facet) and droplet radius side by side for the wires that carry a catalyst droplet: interior vertical wires
/// with a droplet radius. The two means are over the same wires where both exist; a wire seen only as its droplet
/// without a contact angle has no wire radius and counts in <see cref="WithDroplet"/> only.
/// </summary>
/// <param name="WithDroplet">Interior vertical wires with a droplet radius.</param>
/// <param name="WithBoth">Of those, wires with a finite wire radius too.</param>
/// <param name="MeanWireRadiusNm">Mean wire radius over <see cref="WithBoth"/> wires (NaN when none).</param>
/// <param name="MeanDropletRadiusNm">Mean droplet radius over the same <see cref="WithBoth"/> wires (NaN when none).</param>
/// <param name="MeanDropletOnlyRadiusNm">Mean droplet radius of the wires with a droplet but no wire radius (NaN when none).</param>
public sealed record DropletFigures(int WithDroplet, int WithBoth, double MeanWireRadiusNm, double MeanDropletRadiusNm, double MeanDropletOnlyRadiusNm)
{
    /// <summary>No droplets at all.</summary>
    public static DropletFigures None { get; } = new(0, 0, double.NaN, double.NaN, double.NaN);

    /// <summary>The figures of <paramref name="wires"/> (one field, or every field of a wafer pooled).</summary>
    public static DropletFigures From(IEnumerable<FieldWire> wires)
    {
        ArgumentNullException.ThrowIfNull(wires);
        int withDroplet = 0, withBoth = 0, dropletOnly = 0;
        double wireSum = 0, dropletSum = 0, dropletOnlySum = 0;
        foreach (FieldWire w in wires)
        {
            if (!w.Vertical || !w.Interior || w.DropletRadiusNm is not { } droplet || !double.IsFinite(droplet))
            {
                continue;
            }
            withDroplet++;
            if (double.IsFinite(w.RadiusNm))
            {
                withBoth++;
                wireSum += w.RadiusNm;
                dropletSum += droplet;
            }
            else
            {
                dropletOnly++;
                dropletOnlySum += droplet;
            }
        }
        return new DropletFigures(withDroplet, withBoth,
            withBoth > 0 ? wireSum / withBoth : double.NaN,
            withBoth > 0 ? dropletSum / withBoth : double.NaN,
            dropletOnly > 0 ? dropletOnlySum / dropletOnly : double.NaN);
    }
}
