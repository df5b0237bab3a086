namespace RunWatch.Imaging.Decoding;

/// <summary>An image file that could not be decoded; the message names the file and the reason.</summary>
public sealed class ImageDecodeException : Exception
{
    public ImageDecodeException(string filePath, ImageDecodeFailure failure, string reason, Exception? inner = null)
        : base($"{Path.GetFileName(filePath)}: {reason}", inner)
    {
        FilePath = filePath;
        Failure = failure;
        Reason = reason;
    }

    /// <summary>The file that failed.</summary>
    public string FilePath { get; }

    /// <summary>The kind of failure.</summary>
    public ImageDecodeFailure Failure { get; }

    /// <summary>The reason in words, without the file name.</summary>
    public string Reason { get; }
}
