using System.IO.Enumeration;

namespace RunWatch.Wafers.Intake;

/// <summary>
/// One pass over the drop folder: finds files that have stopped growing and passed the name checks. Never moves,
/// renames or changes a file. Symbolic links, empty files and anything that is not a regular file are refused and
/// reported once each; links are never followed.
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
            AttributesToSkip = 0,
            ReturnSpecialDirectories = false,
        };
        // Symbolic links are listed (to be refused, visibly) but never followed, neither into folders nor to files.
        var entries = new FileSystemEnumerable<(string Path, bool Link)>(_root,
            (ref FileSystemEntry e) => (e.ToFullPath(), (e.Attributes & FileAttributes.ReparsePoint) != 0), options)
        {
            ShouldIncludePredicate = (ref FileSystemEntry e) => !e.IsDirectory || (e.Attributes & FileAttributes.ReparsePoint) != 0,
            ShouldRecursePredicate = (ref FileSystemEntry e) => (e.Attributes & FileAttributes.ReparsePoint) == 0,
        };
        foreach (var (full, link) in entries)
        {
            string relative = Path.GetRelativePath(_root, full);
            if (relative.EndsWith(".json", StringComparison.OrdinalIgnoreCase))
            {
                continue; // sidecars travel with their image
            }
            if (FieldFileNameCheck.IsUploadInProgress(relative))
            {
                continue; // the uploader takes it in itself once it is whole
            }
            if (link)
            {
                Refuse(relative, "a symbolic link; copy the file itself into the drop folder", refused);
                continue;
            }
            string? reason = FieldFileNameCheck.Refusal(relative);
            if (reason is null && FieldFileNameCheck.ResolveInside(_root, relative) is null)
            {
                reason = "path leaves the drop folder";
            }
            if (reason is not null)
            {
                Refuse(relative, reason, refused);
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
                if (info.Length == 0)
                {
                    Refuse(relative, "empty (zero bytes) or not a regular file (FIFO, device, socket)", refused);
                }
                else
                {
                    arrived.Add(new ArrivedField(full, relative, info.Length, lastWrite));
                }
            }
        }
    }

    private void Refuse(string relative, string reason, List<RefusedFile> refused)
    {
        if (_refusedReported.Add(relative))
        {
            refused.Add(new RefusedFile(relative, reason));
        }
    }
}
