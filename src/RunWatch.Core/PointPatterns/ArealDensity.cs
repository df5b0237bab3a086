namespace RunWatch.Core.PointPatterns;

/// <summary>Areal number density conversions and lattice densities. DERIVED: 1 cm = 10⁴ µm, so 1 µm⁻² = 10⁸ cm⁻².</summary>
public static class ArealDensity
{
    /// <summary>Square micrometres per square centimetre.</summary>
    public const double SquareMicrometresPerSquareCentimetre = 1e8;

    /// <summary>µm⁻² → cm⁻².</summary>
    public static double PerSquareCentimetre(double perSquareMicrometre) => perSquareMicrometre * SquareMicrometresPerSquareCentimetre;

    /// <summary>cm⁻² → µm⁻².</summary>
    public static double PerSquareMicrometre(double perSquareCentimetre) => perSquareCentimetre / SquareMicrometresPerSquareCentimetre;

    /// <summary>Density of a square lattice of pitch a: 1/a² (per unit² of a's unit).</summary>
    public static double SquareLattice(double pitch) => 1.0 / (pitch * pitch);

    /// <summary>Density of a triangular ("hexagonal") lattice of pitch a: 2/(√3·a²).</summary>
    public static double TriangularLattice(double pitch) => 2.0 / (Math.Sqrt(3.0) * pitch * pitch);
}
