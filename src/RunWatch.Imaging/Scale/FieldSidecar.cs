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
        var info = new FileInfo(path);
        if (!info.Exists && info.LinkTarget is null)
        {
            return null;
        }
        string text = ReadBounded(info);
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

    /// <summary>Largest sidecar read, bytes; a real one is a few hundred.</summary>
    public const int MaxBytes = 64 * 1024;

    /// <summary>
    /// Reads a sidecar that is a regular file of at most <see cref="MaxBytes"/>: a symbolic link (it could name
    /// /dev/zero or a file outside the drop folder), an empty file or anything that is not a regular file (a FIFO or
    /// a device reports length 0 and would block or never end) is refused before it is opened, and never more than
    /// <see cref="MaxBytes"/> + 1 bytes are read.
    /// </summary>
    private static string ReadBounded(FileInfo info)
    {
        if (info.LinkTarget is not null)
        {
            throw new FieldSidecarException(info.FullName, "is a symbolic link; put the sidecar file itself beside the image");
        }
        if (info.Length == 0)
        {
            throw new FieldSidecarException(info.FullName, "is empty or not a regular file");
        }
        if (info.Length > MaxBytes)
        {
            throw new FieldSidecarException(info.FullName, $"is larger than {MaxBytes} bytes");
        }
        using var stream = new FileStream(info.FullName, FileMode.Open, FileAccess.Read, FileShare.Read, 4096, FileOptions.None);
        byte[] buffer = new byte[MaxBytes + 1];
        int total = 0;
        int read;
        while (total < buffer.Length && (read = stream.Read(buffer, total, buffer.Length - total)) > 0)
        {
            total += read;
        }
        if (total > MaxBytes)
        {
            throw new FieldSidecarException(info.FullName, $"is larger than {MaxBytes} bytes");
        }
        try
        {
            return new System.Text.UTF8Encoding(false, throwOnInvalidBytes: true).GetString(buffer, 0, total);
        }
        catch (System.Text.DecoderFallbackException)
        {
            throw new FieldSidecarException(info.FullName, "is not valid UTF-8 text");
        }
    }

    /// <summary>Writes this sidecar beside <paramref name="imagePath"/>.</summary>
    public void WriteFor(string imagePath) => File.WriteAllText(PathFor(imagePath), JsonSerializer.Serialize(this, Json));

    /// <summary>
    /// Reads a sidecar from its text (for one given beside an upload rather than found in the drop folder).
    /// </summary>
    /// <param name="text">The sidecar's JSON, at most <see cref="MaxBytes"/> bytes as UTF-8.</param>
    /// <param name="source">Name used in messages.</param>
    /// <exception cref="FieldSidecarException">The text is not a valid sidecar.</exception>
    public static FieldSidecar Parse(string text, string source)
    {
        ArgumentNullException.ThrowIfNull(text);
        if (System.Text.Encoding.UTF8.GetByteCount(text) > MaxBytes)
        {
            throw new FieldSidecarException(source, $"is larger than {MaxBytes} bytes");
        }
        FieldSidecar? sidecar;
        try
        {
            sidecar = JsonSerializer.Deserialize<FieldSidecar>(text, Json);
        }
        catch (JsonException ex)
        {
            throw new FieldSidecarException(source, "not valid JSON: " + ex.Message);
        }
        if (sidecar is null)
        {
            throw new FieldSidecarException(source, "empty");
        }
        sidecar.Validate(source);
        return sidecar;
    }

    /// <summary>Checks every value against the bounds a sidecar file is held to.</summary>
    /// <exception cref="FieldSidecarException">A value is out of bounds; the message names it.</exception>
    public void Validate(string path)
    {
        if (Format != CurrentFormat)
        {
            throw new FieldSidecarException(path, $"format is '{Format}', expected '{CurrentFormat}'");
        }
        if (PixelSizeNm is { } p && FieldValueBounds.Check("pixelSizeNm", p, FieldValueBounds.MinPixelSizeNm, FieldValueBounds.MaxPixelSizeNm, "nm") is { } pixelProblem)
        {
            throw new FieldSidecarException(path, pixelProblem);
        }
        if (FieldPosition is { } at
            && (FieldValueBounds.Check("fieldPosition.xMm", at.XMm, -FieldValueBounds.MaxPositionMm, FieldValueBounds.MaxPositionMm, "mm")
                ?? FieldValueBounds.Check("fieldPosition.yMm", at.YMm, -FieldValueBounds.MaxPositionMm, FieldValueBounds.MaxPositionMm, "mm")) is { } positionProblem)
        {
            throw new FieldSidecarException(path, positionProblem);
        }
        if (ExcludedBottomRows is > FieldValueBounds.MaxExcludedRows)
        {
            throw new FieldSidecarException(path, "excludedBottomRows must be at most " + FieldValueBounds.MaxExcludedRows.ToString(System.Globalization.CultureInfo.InvariantCulture));
        }
        if (WaferId is { Length: > 64 })
        {
            throw new FieldSidecarException(path, "waferId must be at most 64 characters");
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
