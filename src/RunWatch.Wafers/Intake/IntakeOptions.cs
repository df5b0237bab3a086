using System.ComponentModel.DataAnnotations;

namespace RunWatch.Wafers.Intake;

/// <summary>Where SEM fields arrive and how they are matched to wafers. Bound from the <c>Intake</c> section.</summary>
public sealed class IntakeOptions
{
    public const string SectionName = "Intake";

    /// <summary>Folder watched for new SEM images (relative paths are under the data folder). Default <c>drop</c>.</summary>
    [Required]
    public string DropFolder { get; set; } = "drop";

    /// <summary>Regular expression with a named group <c>wafer</c>, applied to the file name without extension.</summary>
    [Required]
    public string FileNamePattern { get; set; } = WaferIdResolver.DefaultPattern;

    /// <summary>How often the folder is rescanned even without file-system events. Default 5 s.</summary>
    public TimeSpan RescanInterval { get; set; } = TimeSpan.FromSeconds(5);

    /// <summary>How long size and last-write time must stay unchanged before a file is taken in. Default 2 s.</summary>
    public TimeSpan StableFor { get; set; } = TimeSpan.FromSeconds(2);

    /// <summary>Largest upload accepted by the upload endpoint, in bytes. Default 512 MiB.</summary>
    [Range(1, long.MaxValue)]
    public long MaxUploadBytes { get; set; } = 512L * 1024 * 1024;

    /// <summary>Returns the problems with these options, empty when valid.</summary>
    public IReadOnlyList<string> Validate()
    {
        var problems = new List<string>();
        if (string.IsNullOrWhiteSpace(DropFolder))
        {
            problems.Add("Intake:DropFolder is empty");
        }
        try
        {
            _ = new WaferIdResolver(FileNamePattern);
        }
        catch (ArgumentException ex)
        {
            problems.Add("Intake:FileNamePattern: " + ex.Message);
        }
        if (RescanInterval < TimeSpan.FromMilliseconds(100))
        {
            problems.Add("Intake:RescanInterval must be at least 100 ms");
        }
        if (StableFor <= TimeSpan.Zero)
        {
            problems.Add("Intake:StableFor must be positive");
        }
        return problems;
    }
}
