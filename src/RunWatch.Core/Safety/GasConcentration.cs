namespace RunWatch.Core.Safety;

/// <summary>
/// Converts gas concentrations in air between ppm (by volume) and mg/m³ at 25 °C and 1 atm, where one mole of an
/// ideal gas occupies 24.45 L: mg/m³ = ppm · M / 24.45 with M in g/mol (the convention NIOSH and OSHA tables use).
/// </summary>
public static class GasConcentration
{
    /// <summary>Molar volume of an ideal gas at 25 °C and 101.325 kPa, in litres per mole.</summary>
    public const double MolarVolumeLitres25C = 24.45;

    /// <summary>ppm (v/v) to mg/m³ at 25 °C, 1 atm.</summary>
    /// <param name="ppm">Concentration in parts per million by volume.</param>
    /// <param name="molarMassGramsPerMole">Molar mass in g/mol; must be positive.</param>
    public static double PpmToMilligramsPerCubicMetre(double ppm, double molarMassGramsPerMole)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(molarMassGramsPerMole);
        return ppm * molarMassGramsPerMole / MolarVolumeLitres25C;
    }

    /// <summary>mg/m³ to ppm (v/v) at 25 °C, 1 atm.</summary>
    /// <param name="milligramsPerCubicMetre">Concentration in mg/m³.</param>
    /// <param name="molarMassGramsPerMole">Molar mass in g/mol; must be positive.</param>
    public static double MilligramsPerCubicMetreToPpm(double milligramsPerCubicMetre, double molarMassGramsPerMole)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(molarMassGramsPerMole);
        return milligramsPerCubicMetre * MolarVolumeLitres25C / molarMassGramsPerMole;
    }
}
