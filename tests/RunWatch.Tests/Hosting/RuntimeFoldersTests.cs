using RunWatch.Hosting;
using Xunit;

namespace RunWatch.Tests.Hosting;

/// <summary>Relative data and log paths never resolve into a project's source folder.</summary>
public sealed class RuntimeFoldersTests : IDisposable
{
    private readonly string _folder = Directory.CreateTempSubdirectory("runwatch-runtime-").FullName;

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    [Fact]
    public void Resolve_WorkingDirectoryIsAProjectFolder_RelativePathGoesToTheUsersDataFolder()
    {
        File.WriteAllText(Path.Combine(_folder, "RunWatch.csproj"), "<Project />");

        string data = RuntimeFolders.Resolve("data", _folder);

        Assert.False(data.StartsWith(_folder, StringComparison.Ordinal), data + " is inside the project folder");
        string expected = Path.Combine(Environment.GetFolderPath(Environment.SpecialFolder.LocalApplicationData), "runwatch", "data");
        Assert.Equal(expected, data);
    }

    [Fact]
    public void Resolve_OrdinaryWorkingDirectory_RelativeToIt()
    {
        Assert.Equal(Path.Combine(_folder, "data"), RuntimeFolders.Resolve("data", _folder));
    }

    [Fact]
    public void Resolve_AbsolutePath_KeptAsGiven()
    {
        File.WriteAllText(Path.Combine(_folder, "RunWatch.csproj"), "<Project />");
        Assert.Equal("/var/lib/runwatch", RuntimeFolders.Resolve("/var/lib/runwatch", _folder));
    }
}
