using System.Text.Json;
using System.Text.Json.Serialization;

namespace RunWatch.Imaging.Scale;

/// <summary>
/// RunWatch's own sidecar file beside an SEM image, named after the image's full file name plus
/// <c>.field.json</c> (for <c>f01.tif</c>: <c>f01.tif.field.json</c>). Format <c>runwatch-field/1</c>, documented in docs/imaging.md:
/// <code>{"format":"runwatch-field/1","pixelSizeNm":2.5,"waferId":"W-0412-A","fieldPosition":{"xMm":12.5,"yMm":-3},"tiltDeg":0,"excludedBottomRows":64}</code>
/// Every member except <c>format</c> is optional.
/// </summary>
public sealed record FieldSidecar
{
    /// <summary>The only format this version reads and writes.</summary>
    public const string CurrentFormat = "runwatch-field/1";

    /// <summary>File-name suffix appended to the image's full file name.</summary>
    public const string Suffix = ".field.json";

    private static readonly JsonSerializerOptions Json = new()
    {
        PropertyNamingPolicy = JsonNamingPolicy.CamelCase,
        DefaultIgnoreCondition = JsonIgnoreCondition.WhenWritingNull,
        WriteIndented = true,
        ReadCommentHandling = JsonCommentHandling.Skip,
        AllowTrailingCommas = true,
    };

    public string Format { get; init; } = CurrentFormat;

    /// <summary>Pixel edge length in nanometres (square pixels).</summary>
    public double? PixelSizeNm { get; init; }

    public string? WaferId { get; init; }

    public FieldPosition? FieldPosition { get; init; }

    /// <summary>Stage tilt in degrees; the analysis assumes a top-down view and warns when it is not 0.</summary>
    public double? TiltDeg { get; init; }

    /// <summary>Rows at the bottom to leave out (the instrument's information strip); null = detect.</summary>
    public int? ExcludedBottomRows { get; init; }

    /// <summary>The sidecar path for <paramref name="imagePath"/>.</summary>
    public static string PathFor(string imagePath) => imagePath + Suffix;

    /// <summary>Reads the sidecar beside <paramref name="imagePath"/>, or returns null when there is none.</summary>
    /// <exception cref="FieldSidecarException">The sidecar exists but is not valid.</exception>
    public static FieldSidecar? TryLoadFor(string imagePath)
    {
        string path = PathFor(imagePath);
        if (!File.Exists(path))
        {
            return null;
        }
        string text = File.ReadAllText(path);
        FieldSidecar? sidecar;
        try
        {
            sidecar = JsonSerializer.Deserialize<FieldSidecar>(text, Json);
        }
        catch (JsonException ex)
        {
            throw new FieldSidecarException(path, "not valid JSON: " + ex.Message);
        }
        if (sidecar is null)
        {
            throw new FieldSidecarException(path, "empty");
        }
        sidecar.Validate(path);
        return sidecar;
    }

    /// <summary>Writes this sidecar beside <paramref name="imagePath"/>.</summary>
    public void WriteFor(string imagePath) => File.WriteAllText(PathFor(imagePath), JsonSerializer.Serialize(this, Json));

    private void Validate(string path)
    {
        if (Format != CurrentFormat)
        {
            throw new FieldSidecarException(path, $"format is '{Format}', expected '{CurrentFormat}'");
        }
        if (PixelSizeNm is { } p && !(p > 0 && double.IsFinite(p)))
        {
            throw new FieldSidecarException(path, $"pixelSizeNm must be a positive number, got {p}");
        }
        if (TiltDeg is { } t && !(Math.Abs(t) < 90))
        {
            throw new FieldSidecarException(path, $"tiltDeg must lie between -90 and 90, got {t}");
        }
        if (ExcludedBottomRows is < 0)
        {
            throw new FieldSidecarException(path, "excludedBottomRows must not be negative");
        }
    }
}
