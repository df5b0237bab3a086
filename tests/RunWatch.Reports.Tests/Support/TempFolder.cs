namespace RunWatch.Reports.Tests.Support;

/// <summary>A fresh temporary folder removed on dispose.</summary>
internal sealed class TempFolder : IDisposable
{
    public TempFolder()
    {
        Path = Directory.CreateTempSubdirectory("runwatch-reports-").FullName;
    }

    public string Path { get; }

    public void Dispose()
    {
        if (Environment.GetEnvironmentVariable("RUNWATCH_KEEP_REPORTS") is not { Length: > 0 })
        {
            Directory.Delete(Path, recursive: true);
        }
    }
}
