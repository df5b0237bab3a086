namespace RunWatch.Imaging.Decoding;

/// <summary>Limits checked before an image is decoded, so that a hostile or broken header cannot cause an unbounded allocation.</summary>
public sealed class ImageLimits
{
    /// <summary>Largest accepted width × height, in pixels.</summary>
    /// <value>100,000,000 (100 MP).</value>
    public long MaxPixels { get; init; } = 100_000_000;

    /// <summary>Largest accepted file, in bytes.</summary>
    /// <value>1 GiB.</value>
    public long MaxFileBytes { get; init; } = 1L << 30;

    /// <summary>The defaults.</summary>
    public static ImageLimits Default { get; } = new();
}
