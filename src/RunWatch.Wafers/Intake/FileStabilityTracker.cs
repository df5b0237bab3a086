namespace RunWatch.Wafers.Intake;

/// <summary>
/// Tells when a file in the drop folder has stopped growing: its size and last-write time must stay the same for
/// <see cref="StableFor"/> across observations. SEM software and network copies write files in pieces, so a file is
/// never analysed on the first sight of it.
/// </summary>
internal sealed class FileStabilityTracker(TimeSpan stableFor)
{
    private readonly Dictionary<string, (long Size, DateTimeOffset LastWrite, DateTimeOffset Since)> _seen = new(StringComparer.Ordinal);

    public TimeSpan StableFor { get; } = stableFor > TimeSpan.Zero ? stableFor : throw new ArgumentOutOfRangeException(nameof(stableFor));

    /// <summary>Records one observation; returns true the first time the file counts as stable.</summary>
    public bool Observe(string path, long size, DateTimeOffset lastWrite, DateTimeOffset now)
    {
        if (_seen.TryGetValue(path, out var prior))
        {
            if (prior.Size == size && prior.LastWrite == lastWrite)
            {
                if (prior.Since == DateTimeOffset.MaxValue)
                {
                    return false; // already reported
                }
                // A file that stays at zero bytes counts as stable too: the scanner refuses it (empty, or a FIFO,
                // device or socket, which report length 0) instead of watching it for ever.
                if (now - prior.Since >= StableFor)
                {
                    _seen[path] = (size, lastWrite, DateTimeOffset.MaxValue);
                    return true;
                }
                return false;
            }
        }
        _seen[path] = (size, lastWrite, now);
        return false;
    }

    /// <summary>Forgets a file (deleted, or to be taken in again after a change).</summary>
    public void Forget(string path) => _seen.Remove(path);

    /// <summary>Files currently watched but not yet stable.</summary>
    public int Pending
    {
        get
        {
            int n = 0;
            foreach (var v in _seen.Values)
            {
                if (v.Since != DateTimeOffset.MaxValue)
                {
                    n++;
                }
            }
            return n;
        }
    }
}
