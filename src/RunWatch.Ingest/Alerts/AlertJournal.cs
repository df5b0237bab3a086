using System.Text;
using System.Text.Json;

namespace RunWatch.Ingest.Alerts;

/// <summary>
/// A write-ahead file of alert changes not yet in the store: each change is appended and flushed to disk before any
/// sink hears of it, and the file is emptied once every change is stored. A daemon killed while the store is
/// unwritable finds its unsaved alert changes here at the next start and stores them, so no alert that was published
/// is missing from the store. Single writer (the dispatcher). When the journal itself cannot be written (the disk is
/// full as well), the change is still published: an alert that reaches people matters more than its record.
/// </summary>
internal sealed class AlertJournal(string path)
{
    /// <summary>File name inside the data directory.</summary>
    public const string FileName = "alerts-journal.jsonl";

    public string Path { get; } = path;

    /// <summary>Appends one change and flushes it to the disk; false (nothing thrown) when the file cannot be written.</summary>
    public bool TryAppend(Storage.AlertRecord alert)
    {
        try
        {
            byte[] line = JsonSerializer.SerializeToUtf8Bytes(alert, AlertJournalJsonContext.Default.AlertRecord);
            using var stream = new FileStream(Path, FileMode.Append, FileAccess.Write, FileShare.Read);
            stream.Write(line);
            stream.WriteByte((byte)'\n');
            stream.Flush(flushToDisk: true);
            return true;
        }
        catch (IOException)
        {
            return false;
        }
        catch (UnauthorizedAccessException)
        {
            return false;
        }
    }

    /// <summary>The newest journalled change of each alert key, in the order first seen; lines that cannot be read (a torn last line) are skipped.</summary>
    public IReadOnlyList<Storage.AlertRecord> ReadPending()
    {
        if (!File.Exists(Path))
        {
            return [];
        }
        var newest = new Dictionary<string, Storage.AlertRecord>(StringComparer.Ordinal);
        var order = new List<string>();
        foreach (string line in File.ReadLines(Path, Encoding.UTF8))
        {
            if (string.IsNullOrWhiteSpace(line))
            {
                continue;
            }
            Storage.AlertRecord? alert;
            try
            {
                alert = JsonSerializer.Deserialize(line, AlertJournalJsonContext.Default.AlertRecord);
            }
            catch (JsonException)
            {
                continue;
            }
            if (alert is null)
            {
                continue;
            }
            if (!newest.ContainsKey(alert.Key))
            {
                order.Add(alert.Key);
            }
            newest[alert.Key] = alert;
        }
        return [.. order.Select(k => newest[k])];
    }

    /// <summary>Empties the journal (every change is stored).</summary>
    public void Clear()
    {
        try
        {
            if (File.Exists(Path))
            {
                File.Delete(Path);
            }
        }
        catch (IOException)
        {
            // Left in place: replaying stored changes again at the next start is harmless (the store keeps the newest).
        }
    }
}
