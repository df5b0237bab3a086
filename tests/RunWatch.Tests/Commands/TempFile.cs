namespace RunWatch.Tests.Commands;

/// <summary>A temporary file deleted on dispose.</summary>
internal sealed class TempFile : IDisposable
{
    public TempFile(string contents, string extension = ".csv")
    {
        Path = System.IO.Path.Combine(System.IO.Path.GetTempPath(), $"runwatch-test-{Guid.NewGuid():N}{extension}");
        File.WriteAllText(Path, contents);
    }

    public string Path { get; }

    public void Dispose() => File.Delete(Path);
}
