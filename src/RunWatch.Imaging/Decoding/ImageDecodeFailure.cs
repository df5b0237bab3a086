namespace RunWatch.Imaging.Decoding;

/// <summary>Why an image could not be decoded.</summary>
public enum ImageDecodeFailure
{
    /// <summary>The file does not exist or cannot be opened.</summary>
    NotFound,

    /// <summary>The file has zero bytes.</summary>
    Empty,

    /// <summary>The file is larger than <see cref="ImageLimits.MaxFileBytes"/>.</summary>
    FileTooLarge,

    /// <summary>The content is not a TIFF, PNG, JPEG or BMP image.</summary>
    UnsupportedFormat,

    /// <summary>The header claims more pixels than <see cref="ImageLimits.MaxPixels"/>.</summary>
    TooManyPixels,

    /// <summary>The header or pixel data is damaged or ends early.</summary>
    Corrupt,
}
