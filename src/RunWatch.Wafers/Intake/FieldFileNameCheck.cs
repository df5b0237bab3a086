namespace RunWatch.Wafers.Intake;

/// <summary>
/// Decides whether a file that appeared in the drop folder may be taken in. Names are refused rather than
/// "cleaned": a name that tries to leave the folder, hides itself, or carries control characters is reported to
/// a person, never silently renamed.
/// </summary>
internal static class FieldFileNameCheck
{
    /// <summary>Subfolder of the drop folder where uploads land.</summary>
    public const string UploadFolder = "uploads";

    /// <summary>Ending of the hidden file an upload is written to before it is moved into place under its name.</summary>
    public const string UploadPartialSuffix = ".partial";

    /// <summary>
    /// Whether a drop-folder path is an upload still being written (<c>uploads/.&lt;id&gt;.partial</c>): the uploader
    /// takes it in itself once whole, so the folder scan must neither take it in nor list it as refused.
    /// </summary>
    public static bool IsUploadInProgress(string relativePath)
    {
        ArgumentNullException.ThrowIfNull(relativePath);
        string name = Path.GetFileName(relativePath);
        string? folder = Path.GetDirectoryName(relativePath);
        return folder == UploadFolder && name.StartsWith('.') && name.EndsWith(UploadPartialSuffix, StringComparison.Ordinal);
    }

    /// <summary>Longest accepted file name, in characters.</summary>
    public const int MaxNameLength = 200;

    /// <summary>Image extensions the analysis can decode.</summary>
    public static readonly IReadOnlySet<string> ImageExtensions =
        new HashSet<string>(StringComparer.OrdinalIgnoreCase) { ".tif", ".tiff", ".png", ".jpg", ".jpeg", ".bmp" };

    /// <summary>
    /// Checks a path relative to the drop folder. Returns null when it is acceptable, otherwise the reason.
    /// </summary>
    public static string? Refusal(string relativePath)
    {
        ArgumentNullException.ThrowIfNull(relativePath);
        if (relativePath.Length == 0)
        {
            return "empty file name";
        }
        if (Path.IsPathRooted(relativePath))
        {
            return "absolute path";
        }
        foreach (char c in relativePath)
        {
            if (char.IsControl(c))
            {
                return "control character in file name";
            }
        }
        string[] parts = relativePath.Split('/', '\\');
        foreach (string part in parts)
        {
            if (part is ".." or ".")
            {
                return "path leaves or loops in the drop folder";
            }
            if (part.Length == 0)
            {
                return "empty path segment";
            }
        }
        string name = parts[^1];
        if (name.Length > MaxNameLength)
        {
            return $"file name longer than {MaxNameLength} characters";
        }
        if (name.StartsWith('.'))
        {
            return "hidden file";
        }
        if (name.StartsWith('-'))
        {
            return "file name starts with '-'";
        }
        if (name.EndsWith(' ') || name.EndsWith('.'))
        {
            return "file name ends with a space or a dot";
        }
        if (!ImageExtensions.Contains(Path.GetExtension(name)))
        {
            return "not an image file (.tif, .tiff, .png, .jpg, .jpeg, .bmp)";
        }
        return null;
    }

    /// <summary>
    /// Resolves <paramref name="relativePath"/> under <paramref name="root"/> and confirms the result stays inside it
    /// (symbolic tricks and odd separators included). Returns null when it escapes.
    /// </summary>
    public static string? ResolveInside(string root, string relativePath)
    {
        string fullRoot = Path.GetFullPath(root);
        string rootWithSeparator = fullRoot.EndsWith(Path.DirectorySeparatorChar) ? fullRoot : fullRoot + Path.DirectorySeparatorChar;
        string full = Path.GetFullPath(Path.Combine(fullRoot, relativePath));
        return full.StartsWith(rootWithSeparator, StringComparison.Ordinal) ? full : null;
    }
}
