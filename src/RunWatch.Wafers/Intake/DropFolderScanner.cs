namespace RunWatch.Wafers.Intake;

/// <summary>
/// One pass over the drop folder: finds files that have stopped growing and passed the name checks. Never moves,
/// renames or changes a file. Symbolic links are not followed out of the folder.
/// </summary>
internal sealed class DropFolderScanner
{
    private readonly string _root;
    private readonly FileStabilityTracker _tracker;
    private readonly HashSet<string> _refusedReported = new(StringComparer.Ordinal);

    public DropFolderScanner(string root, TimeSpan stableFor)
    {
        _root = Path.GetFullPath(root);
        _tracker = new FileStabilityTracker(stableFor);
    }

    public string Root => _root;

    /// <summary>Files seen but not yet stable.</summary>
    public int Pending => _tracker.Pending;

    /// <summary>Scans once. Newly stable fields go to <paramref name="arrived"/>; newly refused names to <paramref name="refused"/>.</summary>
    public void Scan(DateTimeOffset now, List<ArrivedField> arrived, List<RefusedFile> refused)
    {
        if (!Directory.Exists(_root))
        {
            return;
        }
        var options = new EnumerationOptions
        {
            RecurseSubdirectories = true,
            IgnoreInaccessible = true,
            AttributesToSkip = FileAttributes.ReparsePoint,
            ReturnSpecialDirectories = false,
        };
        foreach (string full in Directory.EnumerateFiles(_root, "*", options))
        {
            string relative = Path.GetRelativePath(_root, full);
            if (relative.EndsWith(".json", StringComparison.OrdinalIgnoreCase))
            {
                continue; // sidecars travel with their image
            }
            string? reason = FieldFileNameCheck.Refusal(relative);
            if (reason is null && FieldFileNameCheck.ResolveInside(_root, relative) is null)
            {
                reason = "path leaves the drop folder";
            }
            if (reason is not null)
            {
                if (_refusedReported.Add(relative))
                {
                    refused.Add(new RefusedFile(relative, reason));
                }
                continue;
            }
            FileInfo info;
            try
            {
                info = new FileInfo(full);
                if (!info.Exists)
                {
                    _tracker.Forget(full);
                    continue;
                }
            }
            catch (IOException)
            {
                continue;
            }
            var lastWrite = new DateTimeOffset(info.LastWriteTimeUtc, TimeSpan.Zero);
            if (_tracker.Observe(full, info.Length, lastWrite, now))
            {
                arrived.Add(new ArrivedField(full, relative, info.Length, lastWrite));
            }
        }
    }
}
