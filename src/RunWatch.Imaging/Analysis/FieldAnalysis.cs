using RunWatch.Imaging.Measurement;
using RunWatch.Imaging.Scale;

namespace RunWatch.Imaging.Analysis;

/// <summary>The result of analysing one SEM field. Immutable.</summary>
public sealed record FieldAnalysis
{
    /// <summary>The image's file name (or the name given for an in-memory image).</summary>
    public required string Source { get; init; }

    public required int Width { get; init; }

    public required int Height { get; init; }

    /// <summary>Source format and bits per pixel, e.g. "PNG, 16 bit".</summary>
    public required string SourceDescription { get; init; }

    public required FieldScale Scale { get; init; }

    /// <summary>"nm" with a scale, else "px".</summary>
    public string LengthUnit => Scale.LengthUnit;

    /// <summary>The threshold applied to the flattened, denoised 16-bit image (foreground is above it).</summary>
    public required int Threshold { get; init; }

    /// <summary>"otsu" or "manual".</summary>
    public required string ThresholdMethod { get; init; }

    /// <summary>Mean background level removed by flattening (16-bit scale), 0 when off.</summary>
    public required double BackgroundRemoved { get; init; }

    /// <summary>Rows at the bottom excluded from analysis.</summary>
    public required int ExcludedBottomRows { get; init; }

    /// <summary>Rows of an information strip found at the top and left out (0 when none).</summary>
    public int ExcludedTopRows { get; init; }

    /// <summary>Length of the scale bar found in the information strip, px; null when none was found.</summary>
    public int? ScaleBarPixels { get; init; }

    /// <summary>That bar's length at the configured scale, in <see cref="LengthUnit"/>: compare it with the number printed on it.</summary>
    public double? ScaleBarLength { get; init; }

    /// <summary>Where the excluded band came from: "sidecar", "given", "detected" or "none".</summary>
    public required string ExcludedBandSource { get; init; }

    public string? WaferId { get; init; }

    public FieldPosition? FieldPosition { get; init; }

    public double? TiltDeg { get; init; }

    /// <summary>Edge blur σ (px) measured on the field's clean wire edges, used to correct sub-pixel areas; NaN when not measured.</summary>
    public double EdgeSigmaPixels { get; init; } = double.NaN;

    /// <summary>Where the field's fitted edge model puts the true edge relative to the half-level crossings, px (negative = inside; a bright rim pushes the crossings out). NaN when not fitted.</summary>
    public double EdgeOffsetPixels { get; init; } = double.NaN;

    /// <summary>How wire radii were measured, in words.</summary>
    public string RadiusMethod { get; init; } = "threshold outline area";

    /// <summary>Every object found, in label order.</summary>
    public required IReadOnlyList<WireMeasurement> Wires { get; init; }

    public required FieldStatistics Statistics { get; init; }

    /// <summary>Cautions in words (no scale, tilt, no wires found ...).</summary>
    public required IReadOnlyList<string> Notes { get; init; }

    public required IReadOnlyList<StageTiming> Timings { get; init; }

    /// <summary>True when no object was found.</summary>
    public bool NoWiresFound => Wires.Count == 0;
}
