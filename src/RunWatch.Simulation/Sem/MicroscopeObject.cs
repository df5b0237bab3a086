namespace RunWatch.Simulation.Sem;

/// <summary>
/// One object drawn by <see cref="MicroscopeFieldGenerator"/> (ground truth, invented data). Positions are image
/// pixels (the image spans [0, width] × [0, height], y down), after the field tilt's foreshortening; sizes are in
/// pixels of the sample plane (before foreshortening), so a top-down analysis corrected for tilt should recover them.
/// </summary>
public sealed record MicroscopeObject
{
    public required SemObjectKind Kind { get; init; }

    /// <summary>Centre x in the image.</summary>
    public required double X { get; init; }

    /// <summary>Centre y in the image (foreshortened by the field tilt).</summary>
    public required double Y { get; init; }

    /// <summary>Hexagon side a (= circumradius) of a wire top; half-width of a tilted wire; mean radius of a crystallite.</summary>
    public required double Size { get; init; }

    /// <summary>Hexagon rotation, or the direction of a tilted wire, in degrees.</summary>
    public double AngleDeg { get; init; }

    /// <summary>Length of a tilted wire's projection, 0 otherwise.</summary>
    public double Length { get; init; }

    /// <summary>Radius of the catalyst droplet seen from the top (0 = none), sample-plane pixels.</summary>
    public double DropletRadius { get; init; }

    /// <summary>Touching group (0 = none); members of one pair or chain share it.</summary>
    public int Group { get; init; }

    public TouchArrangement Touch { get; init; }

    /// <summary>Crystallite outline: vertices relative to the centre, sample-plane pixels, counter-clockwise in angle.</summary>
    public IReadOnlyList<(double X, double Y)> Outline { get; init; } = [];

    /// <summary>Top-level brightness factor relative to a wire top (crystallites vary).</summary>
    public double BrightnessFactor { get; init; } = 1;

    /// <summary>Exact area in sample-plane px²: (3√3/2)a² for a hexagon, the shoelace area of a crystallite's outline, the stadium for a tilted wire.</summary>
    public double TrueArea => Kind switch
    {
        SemObjectKind.Vertical => 1.5 * Math.Sqrt(3) * Size * Size,
        SemObjectKind.Tilted => Math.PI * Size * Size + 2 * Size * Length,
        _ => ShoelaceArea(),
    };

    /// <summary>√(area/π) in sample-plane px: the radius a measurement of this wire's facet should find.</summary>
    public double EquivalentRadius => Math.Sqrt(TrueArea / Math.PI);

    /// <summary>The hexagon's corners are hidden: the droplet's disc covers the whole facet.</summary>
    public bool OnlyDropletVisible => DropletRadius >= Size;

    private double ShoelaceArea()
    {
        double twice = 0;
        for (int i = 0; i < Outline.Count; i++)
        {
            var a = Outline[i];
            var b = Outline[(i + 1) % Outline.Count];
            twice += (a.X * b.Y) - (b.X * a.Y);
        }
        return Math.Abs(twice) / 2;
    }
}
