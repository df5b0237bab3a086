using System.CommandLine;
using System.Globalization;
using RunWatch.Backup;
using RunWatch.Hosting;

namespace RunWatch.Commands;

/// <summary>
/// <c>runwatch backup DEST [--data-folder DIR]</c> and <c>runwatch restore ARCHIVE --data-folder DIR</c>: one archive
/// of the database (SQLite online backup, safe while the daemon runs), reports, overlays, drop folder and the files
/// kept beside them, with a manifest of hashes; restore only into an empty folder, every hash checked.
/// </summary>
internal static class BackupCommand
{
    public static Command CreateBackup()
    {
        var destination = new Argument<string>("DEST") { Description = "Archive file to write (a tar file; must not exist)." };
        var dataFolder = DataFolderOption();
        var command = new Command("backup", "Write one consistent archive of a data folder, also while the daemon runs.") { destination, dataFolder };
        command.SetAction(parse =>
        {
            string folder = RuntimeFolders.Resolve(parse.GetValue(dataFolder)!);
            string archive = Path.GetFullPath(parse.GetValue(destination)!);
            try
            {
                var manifest = DataArchive.Create(folder, "runwatch.db", archive, DateTimeOffset.UtcNow);
                Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"backed up {manifest.Files.Count} files of {folder} to {archive}"));
                return 0;
            }
            catch (Exception ex) when (ex is IOException or UnauthorizedAccessException or Microsoft.Data.Sqlite.SqliteException)
            {
                Console.Error.WriteLine("runwatch backup: " + ex.Message);
                return 2;
            }
        });
        return command;
    }

    public static Command CreateRestore()
    {
        var archive = new Argument<string>("ARCHIVE") { Description = "Archive written by runwatch backup." };
        var dataFolder = DataFolderOption();
        var command = new Command("restore", "Restore an archive into an empty data folder, checking every file's hash.") { archive, dataFolder };
        command.SetAction(parse =>
        {
            string folder = RuntimeFolders.Resolve(parse.GetValue(dataFolder)!);
            try
            {
                var manifest = DataArchive.Restore(Path.GetFullPath(parse.GetValue(archive)!), folder);
                Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"restored {manifest.Files.Count} files into {folder}; every hash matches"));
                return 0;
            }
            catch (Exception ex) when (ex is IOException or UnauthorizedAccessException or InvalidOperationException or InvalidDataException)
            {
                Console.Error.WriteLine("runwatch restore: " + ex.Message);
                return 2;
            }
        });
        return command;
    }

    private static Option<string> DataFolderOption() =>
        new("--data-folder") { Description = "The data folder (Storage:DataDirectory).", DefaultValueFactory = _ => "data" };
}
