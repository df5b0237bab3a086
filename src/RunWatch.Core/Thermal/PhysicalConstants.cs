namespace RunWatch.Core.Thermal;

/// <summary>
/// Physical constants and the temperature scale used by the thermal physics.
/// Sources: SI Brochure, 9th ed. (BIPM 2019) and CODATA 2018 (Tiesinga et al., Rev. Mod. Phys. 93, 025010, 2021)
/// for the defining constants; ITS-90 (Preston-Thomas, Metrologia 27, 3-10, 1990) for 0 °C = 273.15 K.
/// </summary>
public static class PhysicalConstants
{
    /// <summary>Boltzmann constant in J/K, exact in the 2019 SI.</summary>
    public const double BoltzmannJPerK = 1.380649e-23;

    /// <summary>Elementary charge in C, exact in the 2019 SI.</summary>
    public const double ElementaryChargeC = 1.602176634e-19;

    /// <summary>Boltzmann constant in eV/K, computed from the two exact SI constants (8.617333262...e-5).</summary>
    public const double BoltzmannEvPerK = BoltzmannJPerK / ElementaryChargeC;

    /// <summary>The ice point on the thermodynamic scale: T/K = t/°C + 273.15 (ITS-90).</summary>
    public const double ZeroCelsiusK = 273.15;

    /// <summary>Converts a Celsius temperature to kelvin.</summary>
    public static double CelsiusToKelvin(double celsius) => celsius + ZeroCelsiusK;

    /// <summary>Converts a kelvin temperature to Celsius.</summary>
    public static double KelvinToCelsius(double kelvin) => kelvin - ZeroCelsiusK;
}
