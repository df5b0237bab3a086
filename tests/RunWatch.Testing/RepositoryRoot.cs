namespace RunWatch.Testing;

/// <summary>The repository's root folder, found by walking up from the test binaries to RunWatch.sln.</summary>
public static class RepositoryRoot
{
    private static readonly Lazy<string> Root = new(Find);

    public static string Path => Root.Value;

    private static string Find()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(System.IO.Path.Combine(dir.FullName, "RunWatch.sln")))
        {
            dir = dir.Parent;
        }
        return dir?.FullName ?? throw new InvalidOperationException("RunWatch.sln not found above " + AppContext.BaseDirectory);
    }
}
