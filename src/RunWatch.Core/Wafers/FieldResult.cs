namespace RunWatch.Core.Wafers;

/// <summary>
/// What the wafer pipeline keeps of one field's analysis (stored as the analysis's results JSON): enough to
/// aggregate a wafer, recompute capture zones at another L and write the report, without the image.
/// </summary>
public sealed record FieldResult
{
    /// <summary>Format tag of this record, bumped when its meaning changes.</summary>
    public const string CurrentFormat = "runwatch-field-result/1";

    public string Format { get; init; } = CurrentFormat;

    /// <summary>Image file name.</summary>
    public required string FieldName { get; init; }

    /// <summary>Pixel size, nm.</summary>
    public required double PixelSizeNm { get; init; }

    /// <summary>Image width, nm.</summary>
    public required double WidthNm { get; init; }

    /// <summary>Analysed height (image height less the excluded band), nm.</summary>
    public required double AnalysedHeightNm { get; init; }

    /// <summary>Threshold applied (16-bit scale) and how it was chosen.</summary>
    public required string Threshold { get; init; }

    /// <summary>Analysed area, cm².</summary>
    public required double AnalysedAreaCm2 { get; init; }

    /// <summary>Wire density over the analysed area, cm⁻² (all objects found).</summary>
    public double? DensityPerCm2 { get; init; }

    /// <summary>Fraction of interior objects classified vertical.</summary>
    public double VerticalYield { get; init; }

    /// <summary>Diffusion length used for the capture zones, nm.</summary>
    public double? DiffusionLengthNm { get; init; }

    /// <summary>Clark–Evans ratio of the field's pattern, if computed.</summary>
    public double? ClarkEvansR { get; init; }

    /// <summary>Field position on the wafer (mm), when the sidecar gave it.</summary>
    public double? PositionXMm { get; init; }

    public double? PositionYMm { get; init; }

    /// <summary>Cautions from the analysis.</summary>
    public IReadOnlyList<string> Notes { get; init; } = [];

    public IReadOnlyList<FieldWire> Wires { get; init; } = [];
}
