namespace RunWatch.Storage;

/// <summary>One SEM image (a field) of a wafer, or one waiting for its wafer.</summary>
public sealed record FieldRecord
{
    /// <summary>Store id; 0 before it is stored.</summary>
    public long Id { get; init; }

    /// <summary>Wafer name; null while unassigned.</summary>
    public string? Wafer { get; init; }

    /// <summary>Absolute path of the image file.</summary>
    public required string FilePath { get; init; }

    /// <summary>Path relative to the drop folder, as shown to people.</summary>
    public required string RelativePath { get; init; }

    /// <summary>SHA-256 of the file's bytes (hex): the same image dropped twice is one field.</summary>
    public required string Sha256 { get; init; }

    /// <summary>File size, bytes.</summary>
    public long SizeBytes { get; init; }

    /// <summary>Image width, px, once known.</summary>
    public int? WidthPx { get; init; }

    /// <summary>Image height, px, once known.</summary>
    public int? HeightPx { get; init; }

    /// <summary>Pixel size, nm, once known.</summary>
    public double? NmPerPx { get; init; }

    /// <summary>Field position on the wafer, mm (x), when the sidecar gives it.</summary>
    public double? PositionXMm { get; init; }

    /// <summary>Field position on the wafer, mm (y), when the sidecar gives it.</summary>
    public double? PositionYMm { get; init; }

    /// <summary>When it was taken in.</summary>
    public DateTimeOffset ImportedAt { get; init; }

    /// <summary>Pipeline status.</summary>
    public FieldStatus Status { get; init; }

    /// <summary>Why it failed or waits, if it does.</summary>
    public string? Problem { get; init; }

    /// <summary>Sidecar and other metadata as JSON, if any.</summary>
    public string? MetadataJson { get; init; }
}
