using System.Formats.Tar;
using System.Security.Cryptography;
using System.Text.Json;
using Microsoft.Data.Sqlite;

namespace RunWatch.Backup;

/// <summary>
/// One consistent archive of a data folder (a tar file): the SQLite database copied with SQLite's online backup API
/// (consistent while the daemon writes), every other file of the folder (reports, overlays, the drop folder's images
/// and sidecars, the alert journal, the chamber file and any configuration kept there), and <c>manifest.json</c> with
/// the size and SHA-256 of each. Restoring writes into an empty folder only and checks every hash.
/// </summary>
internal static class DataArchive
{
    public const string ManifestName = "manifest.json";
    public const string Format = "runwatch-backup/1";

    private static readonly JsonSerializerOptions Json = new() { WriteIndented = true, PropertyNamingPolicy = JsonNamingPolicy.CamelCase };

    /// <summary>Writes the archive of <paramref name="dataFolder"/> to <paramref name="archivePath"/>; returns the manifest.</summary>
    public static BackupManifest Create(string dataFolder, string databaseFile, string archivePath, DateTimeOffset now)
    {
        string root = Path.GetFullPath(dataFolder);
        string database = Path.Combine(root, databaseFile);
        if (!File.Exists(database))
        {
            throw new FileNotFoundException("no database in the data folder", database);
        }
        string staging = Directory.CreateTempSubdirectory("runwatch-backup-").FullName;
        try
        {
            string snapshot = Path.Combine(staging, databaseFile);
            using (var source = new SqliteConnection(new SqliteConnectionStringBuilder { DataSource = database, Mode = SqliteOpenMode.ReadOnly, Pooling = false }.ToString()))
            using (var target = new SqliteConnection(new SqliteConnectionStringBuilder { DataSource = snapshot, Pooling = false }.ToString()))
            {
                source.Open();
                target.Open();
                source.BackupDatabase(target);
            }
            var entries = new List<BackupEntry> { Entry(databaseFile, snapshot) };
            var files = new List<(string Name, string Path)> { (databaseFile, snapshot) };
            foreach (string file in Directory.EnumerateFiles(root, "*", new EnumerationOptions { RecurseSubdirectories = true, AttributesToSkip = FileAttributes.ReparsePoint }))
            {
                string name = Path.GetRelativePath(root, file).Replace('\\', '/');
                // The live database files come from the snapshot; empty entries (and FIFOs, which report length 0 and
                // would block a read) carry nothing.
                if (name == databaseFile || name == databaseFile + "-wal" || name == databaseFile + "-shm" || name == databaseFile + "-journal"
                    || new FileInfo(file).Length == 0)
                {
                    continue;
                }
                entries.Add(Entry(name, file));
                files.Add((name, file));
            }
            var manifest = new BackupManifest(Format, now, databaseFile, entries);
            string manifestPath = Path.Combine(staging, ManifestName);
            File.WriteAllText(manifestPath, JsonSerializer.Serialize(manifest, Json));
            string partial = archivePath + ".partial";
            using (var output = File.Create(partial))
            using (var tar = new TarWriter(output, TarEntryFormat.Pax, leaveOpen: false))
            {
                tar.WriteEntry(manifestPath, ManifestName);
                foreach (var (name, path) in files)
                {
                    tar.WriteEntry(path, name);
                }
            }
            File.Move(partial, archivePath, overwrite: false);
            return manifest;
        }
        finally
        {
            SqliteConnection.ClearAllPools();
            Directory.Delete(staging, recursive: true);
        }
    }

    /// <summary>Restores <paramref name="archivePath"/> into <paramref name="dataFolder"/>, which must be empty or absent; every hash is checked.</summary>
    /// <exception cref="InvalidOperationException">The folder is not empty, or the archive is not whole.</exception>
    public static BackupManifest Restore(string archivePath, string dataFolder)
    {
        string root = Path.GetFullPath(dataFolder);
        if (Directory.Exists(root) && Directory.EnumerateFileSystemEntries(root).Any())
        {
            throw new InvalidOperationException("restore writes into an empty data folder only; " + root + " is not empty");
        }
        Directory.CreateDirectory(root);
        BackupManifest? manifest = null;
        using (var input = File.OpenRead(archivePath))
        using (var tar = new TarReader(input))
        {
            TarEntry? entry;
            while ((entry = tar.GetNextEntry()) is not null)
            {
                if (entry.EntryType is not (TarEntryType.RegularFile or TarEntryType.V7RegularFile))
                {
                    throw new InvalidOperationException("the archive holds something that is not a regular file: " + entry.Name);
                }
                if (entry.Name == ManifestName)
                {
                    manifest = JsonSerializer.Deserialize<BackupManifest>(entry.DataStream!, Json);
                    continue;
                }
                string target = Path.GetFullPath(Path.Combine(root, entry.Name));
                if (!target.StartsWith(root + Path.DirectorySeparatorChar, StringComparison.Ordinal))
                {
                    throw new InvalidOperationException("the archive names a path outside the data folder: " + entry.Name);
                }
                Directory.CreateDirectory(Path.GetDirectoryName(target)!);
                entry.ExtractToFile(target, overwrite: false);
            }
        }
        if (manifest is null || manifest.Format != Format)
        {
            throw new InvalidOperationException("the archive has no " + Format + " manifest");
        }
        foreach (BackupEntry expected in manifest.Files)
        {
            string path = Path.Combine(root, expected.Path);
            if (!File.Exists(path) || Entry(expected.Path, path) != expected)
            {
                throw new InvalidOperationException("restored file differs from the manifest: " + expected.Path);
            }
        }
        return manifest;
    }

    private static BackupEntry Entry(string name, string path)
    {
        using var stream = File.OpenRead(path);
        return new BackupEntry(name, stream.Length, Convert.ToHexStringLower(SHA256.HashData(stream)));
    }
}
