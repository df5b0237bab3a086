namespace RunWatch.Hosting;

/// <summary>
/// Where relative runtime paths (the data folder, the log file) land. Relative to the working directory, except when
/// the working directory is a project's source folder (it holds a *.csproj, as under <c>dotnet run --project</c>):
/// then under the user's local data folder (<c>~/.local/share/runwatch</c> on Linux), so that no database, sidecar or
/// log ends up in the source tree, where the Web SDK would copy every .json into each build output.
/// </summary>
internal static class RuntimeFolders
{
    /// <summary>The base for relative runtime paths in this process.</summary>
    public static string Base(string workingDirectory)
    {
        ArgumentNullException.ThrowIfNull(workingDirectory);
        bool sourceFolder = Directory.Exists(workingDirectory) && Directory.EnumerateFiles(workingDirectory, "*.csproj").Any();
        return sourceFolder
            ? Path.Combine(Environment.GetFolderPath(Environment.SpecialFolder.LocalApplicationData, Environment.SpecialFolderOption.Create), "runwatch")
            : workingDirectory;
    }

    /// <summary><paramref name="path"/> made absolute against <see cref="Base"/> of the current directory.</summary>
    public static string Resolve(string path) => Resolve(path, Environment.CurrentDirectory);

    /// <summary><paramref name="path"/> made absolute against <see cref="Base"/> of <paramref name="workingDirectory"/>.</summary>
    public static string Resolve(string path, string workingDirectory)
    {
        ArgumentNullException.ThrowIfNull(path);
        return Path.IsPathRooted(path) ? Path.GetFullPath(path) : Path.GetFullPath(Path.Combine(Base(workingDirectory), path));
    }
}
