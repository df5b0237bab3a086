namespace RunWatch.Simulation.Sem;

/// <summary>One drawn object (the generator's ground truth), in pixels; the image spans [0, width] × [0, height].</summary>
/// <param name="Kind">What was drawn.</param>
/// <param name="X">Centre x.</param>
/// <param name="Y">Centre y.</param>
/// <param name="Size">Hexagon side a (= circumradius) for a vertical wire; half-width for a tilted one; cluster radius for a parasite.</param>
/// <param name="Length">Length of a tilted wire's projection, 0 otherwise.</param>
/// <param name="AngleDeg">Rotation of the hexagon or direction of the tilted wire.</param>
public readonly record struct SemObject(SemObjectKind Kind, double X, double Y, double Size, double Length, double AngleDeg)
{
    /// <summary>Exact area of a vertical wire's hexagon, (3√3/2)a².</summary>
    public double HexagonArea => 1.5 * Math.Sqrt(3) * Size * Size;
}
