using RunWatch.Imaging.Scale;
using RunWatch.Imaging.Decoding;
using RunWatch.Imaging.Measurement;

namespace RunWatch.Imaging.Analysis;

/// <summary>Settings of one field analysis (init-only properties, bindable from a <c>FieldAnalysis</c> configuration section). Validate with <see cref="Validate"/>.</summary>
public sealed class FieldAnalysisOptions
{
    /// <summary>Pixel size in nm given on the command line or in config; a sidecar overrides it, it overrides TIFF tags.</summary>
    public double? PixelSizeNm { get; init; }

    /// <summary>Diffusion length L in nm for capture zones; needs a scale. Null skips zones.</summary>
    public double? DiffusionLengthNm { get; init; }

    /// <summary>Diffusion length L in pixels, for fields without a scale (ignored when <see cref="DiffusionLengthNm"/> is set and a scale exists).</summary>
    public double? DiffusionLengthPixels { get; init; }

    /// <summary>Subtract the background estimated by a grey-scale opening of this width (px). 0 turns flattening off.</summary>
    /// <value>96 px: several times the widest expected wire.</value>
    public int BackgroundWindowPixels { get; init; } = 96;

    /// <summary>Radius of the 3×3 box applied twice for denoising (a 5×5 triangular kernel); 0 turns it off.</summary>
    /// <value>1</value>
    public int DenoiseRadius { get; init; } = 1;

    /// <summary>A fixed threshold on the flattened, denoised 16-bit image instead of Otsu's.</summary>
    public int? ManualThreshold { get; init; }

    /// <summary>Smallest rise (px) of a distance-transform peak above the saddle to its neighbour for it to mark a separate wire.</summary>
    /// <value>1.0 px</value>
    public double HMaximaPixels { get; init; } = 1.0;

    /// <summary>Components with area ≤ this × π·(inscribed radius)² are taken as single wires without flooding.</summary>
    /// <value>1.3 (a regular hexagon gives 1.10, two touching discs 2)</value>
    public double CompactFactor { get; init; } = 1.3;

    /// <summary>Enclosed background up to this many pixels joins the object around it (a top darker than its rim); 0 turns hole filling off.</summary>
    /// <value>4096</value>
    public int MaxHolePixels { get; init; } = 4096;

    /// <summary>Cut a piece between two outline notches at least this deep inside its convex hull (touching tops that the watershed cannot part); 0 turns it off.</summary>
    /// <value>1.5 px (a pixelised single hexagon has notches under 1 px)</value>
    public double NotchDepthPixels { get; init; } = 1.5;

    /// <summary>Objects smaller than this many pixels are dropped as noise.</summary>
    /// <value>10</value>
    public int MinWireAreaPixels { get; init; } = 10;

    /// <summary>Rows at the bottom to exclude (information strip). Null: the sidecar's value, else detection.</summary>
    public int? ExcludedBottomRows { get; init; }

    /// <summary>Detect a uniform information strip at the bottom when no row count is given.</summary>
    /// <value>true</value>
    public bool DetectInfoStrip { get; init; } = true;

    /// <summary>Measure radii at the sub-pixel edge (half-maximum along rays, docs/imaging.md); false keeps the threshold outline's area.</summary>
    /// <value>true</value>
    public bool SubPixelEdges { get; init; } = true;

    /// <summary>
    /// The process's droplet contact angle θ in degrees (&gt; 90°), for wires of which only the droplet is visible:
    /// r_wire = r_drop·sin θ (spherical cap). Null: such wires report the droplet radius only and stay out of the radius statistics.
    /// </summary>
    public double? DropletContactAngleDeg { get; init; }

    public ClassificationOptions Classification { get; init; } = new();

    public ImageLimits Limits { get; init; } = ImageLimits.Default;

    /// <summary>Keep the zone label map for overlays (one int per pixel more memory).</summary>
    public bool KeepZoneMap { get; init; }

    public void Validate()
    {
        if (PixelSizeNm is { } p && FieldValueBounds.Check(nameof(PixelSizeNm), p, FieldValueBounds.MinPixelSizeNm, FieldValueBounds.MaxPixelSizeNm, "nm") is { } pixelProblem)
        {
            throw new ArgumentOutOfRangeException(nameof(PixelSizeNm), p, pixelProblem);
        }
        if (DiffusionLengthNm is { } l && FieldValueBounds.Check(nameof(DiffusionLengthNm), l, FieldValueBounds.MinDiffusionLengthNm, FieldValueBounds.MaxDiffusionLengthNm, "nm") is { } lengthProblem)
        {
            throw new ArgumentOutOfRangeException(nameof(DiffusionLengthNm), l, lengthProblem);
        }
        if (DiffusionLengthPixels is { } lp && FieldValueBounds.Check(nameof(DiffusionLengthPixels), lp, 0.01, 1e5, "pixels") is { } pixelsProblem)
        {
            throw new ArgumentOutOfRangeException(nameof(DiffusionLengthPixels), lp, pixelsProblem);
        }
        if (BackgroundWindowPixels < 0 || DenoiseRadius < 0 || DenoiseRadius > 10)
        {
            throw new ArgumentOutOfRangeException(nameof(BackgroundWindowPixels), "background window must be ≥ 0 and denoise radius 0..10");
        }
        if (ManualThreshold is < 0 or > ushort.MaxValue)
        {
            throw new ArgumentOutOfRangeException(nameof(ManualThreshold), ManualThreshold, "must lie in 0..65535");
        }
        if (!(HMaximaPixels >= 0) || !(CompactFactor >= 1))
        {
            throw new ArgumentOutOfRangeException(nameof(HMaximaPixels), "h must be ≥ 0 and the compact factor ≥ 1");
        }
        if (!(NotchDepthPixels >= 0))
        {
            throw new ArgumentOutOfRangeException(nameof(NotchDepthPixels), NotchDepthPixels, "must not be negative");
        }
        if (MaxHolePixels < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(MaxHolePixels), MaxHolePixels, "must not be negative");
        }
        if (MinWireAreaPixels < 1)
        {
            throw new ArgumentOutOfRangeException(nameof(MinWireAreaPixels), MinWireAreaPixels, "must be at least 1");
        }
        if (ExcludedBottomRows is < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(ExcludedBottomRows), ExcludedBottomRows, "must not be negative");
        }
        if (DropletContactAngleDeg is { } theta && !(theta > 90 && theta < 180))
        {
            throw new ArgumentOutOfRangeException(nameof(DropletContactAngleDeg), theta, "must lie between 90° and 180° (a droplet hiding its facet)");
        }
        Classification.Validate();
    }
}
