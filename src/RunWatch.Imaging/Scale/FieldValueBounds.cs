using System.Globalization;

namespace RunWatch.Imaging.Scale;

/// <summary>
/// Physical ranges every pixel size, length and position must lie in, wherever it comes from (sidecar, TIFF tags,
/// command-line option, configuration). Outside them a value is a typo or an attack, not a measurement: 1e-300 nm per
/// pixel makes the neighbour search spin for minutes, 1e308 overflows the areas. The ranges are generous on purpose.
/// </summary>
public static class FieldValueBounds
{
    /// <summary>Smallest pixel size accepted, nm (0.001 nm: far below any SEM; COMMON PRACTICE, no source).</summary>
    public const double MinPixelSizeNm = 1e-3;

    /// <summary>Largest pixel size accepted, nm (100 µm per pixel, the top of <see cref="ScaleResolver"/>'s TIFF band).</summary>
    public const double MaxPixelSizeNm = 1e5;

    /// <summary>Smallest diffusion length accepted, nm.</summary>
    public const double MinDiffusionLengthNm = 0.1;

    /// <summary>Largest diffusion length accepted, nm (1 mm).</summary>
    public const double MaxDiffusionLengthNm = 1e6;

    /// <summary>Largest |coordinate| of a field position on the stage, mm (a 450 mm wafer has 225 mm).</summary>
    public const double MaxPositionMm = 500;

    /// <summary>Largest number of rows an information strip may take.</summary>
    public const int MaxExcludedRows = 100_000;

    /// <summary>Null when <paramref name="value"/> lies in [<paramref name="min"/>, <paramref name="max"/>]; otherwise why not, naming the field.</summary>
    public static string? Check(string field, double value, double min, double max, string unit) =>
        value >= min && value <= max
            ? null
            : string.Create(CultureInfo.InvariantCulture, $"{field} must lie between {min:G} and {max:G} {unit}, got {value:G}");
}
