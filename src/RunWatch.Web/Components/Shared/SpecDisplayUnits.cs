namespace RunWatch.Web.Components.Shared;

/// <summary>
/// The units the screens show spec limits in, as everywhere else on the dashboard: fractions as percent, densities
/// in µm⁻². Specs are stored as the verdict rules take them (fractions 0..1, densities per cm²); 1 µm⁻² = 10⁸ cm⁻²
/// (DERIVED: 1 cm = 10⁴ µm).
/// </summary>
public static class SpecDisplayUnits
{
    private const double CmSquaredPerMicronSquared = 1e8;

    /// <summary>The unit shown for a stored unit.</summary>
    public static string Unit(string storedUnit) => storedUnit switch
    {
        "fraction" => "%",
        "cm⁻²" => "µm⁻²",
        _ => storedUnit,
    };

    /// <summary>A stored limit in the unit shown (rounded to 9 decimals so that 0.35 shows as 35, not 35.000000000000007).</summary>
    public static double? ToShown(double? stored, string storedUnit) => stored is not { } v ? null : storedUnit switch
    {
        "fraction" => Math.Round(v * 100, 9),
        "cm⁻²" => Math.Round(v / CmSquaredPerMicronSquared, 9),
        _ => v,
    };

    /// <summary>A limit typed in the unit shown, back in the stored unit.</summary>
    public static double? ToStored(double? shown, string storedUnit) => shown is not { } v ? null : storedUnit switch
    {
        "fraction" => v / 100,
        "cm⁻²" => v * CmSquaredPerMicronSquared,
        _ => v,
    };
}
