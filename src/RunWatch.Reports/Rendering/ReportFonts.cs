using SkiaSharp;

namespace RunWatch.Reports.Rendering;

/// <summary>
/// Locates and loads the DejaVu TrueType fonts used by charts and PDFs. SkiaSharp's NoDependencies build has no
/// fontconfig, so text can render blank unless the files are loaded explicitly. The folder is
/// <c>RUNWATCH_FONT_DIR</c> when set, else the first standard location that holds DejaVuSans.ttf.
/// Thread-safe; loads once per process.
/// </summary>
internal static class ReportFonts
{
    public const string Sans = "DejaVu Sans";
    public const string Mono = "DejaVu Sans Mono";

    // Standard Debian/Ubuntu, Fedora and Arch locations of the DejaVu package.
    private static readonly string[] StandardFolders =
    [
        "/usr/share/fonts/truetype/dejavu",
        "/usr/share/fonts/dejavu",
        "/usr/share/fonts/TTF",
        "/usr/local/share/fonts/dejavu",
    ];

    private static readonly Lazy<LoadedFonts> Loaded = new(Load, LazyThreadSafetyMode.ExecutionAndPublication);

    public static SKTypeface Regular => Loaded.Value.Regular;

    public static SKTypeface Bold => Loaded.Value.Bold;

    public static SKTypeface Monospace => Loaded.Value.Monospace;

    public static string Folder => Loaded.Value.Folder;

    /// <summary>Registers the fonts with ScottPlot (idempotent).</summary>
    public static void EnsureLoaded() => _ = Loaded.Value;

    private static LoadedFonts Load()
    {
        string folder = FindFolder();
        string regular = Path.Combine(folder, "DejaVuSans.ttf");
        string bold = Path.Combine(folder, "DejaVuSans-Bold.ttf");
        string mono = Path.Combine(folder, "DejaVuSansMono.ttf");
        ScottPlot.Fonts.AddFontFile(Sans, regular, bold: false, italic: false);
        if (File.Exists(bold))
        {
            ScottPlot.Fonts.AddFontFile(Sans, bold, bold: true, italic: false);
        }
        if (File.Exists(mono))
        {
            ScottPlot.Fonts.AddFontFile(Mono, mono, bold: false, italic: false);
        }
        SKTypeface regularFace = SKTypeface.FromFile(regular) ?? throw new InvalidOperationException($"Could not load font {regular}.");
        SKTypeface boldFace = (File.Exists(bold) ? SKTypeface.FromFile(bold) : null) ?? regularFace;
        SKTypeface monoFace = (File.Exists(mono) ? SKTypeface.FromFile(mono) : null) ?? regularFace;
        return new LoadedFonts(folder, regularFace, boldFace, monoFace);
    }

    private static string FindFolder()
    {
        if (Environment.GetEnvironmentVariable("RUNWATCH_FONT_DIR") is { Length: > 0 } configured)
        {
            if (File.Exists(Path.Combine(configured, "DejaVuSans.ttf")))
            {
                return configured;
            }
            throw new InvalidOperationException($"RUNWATCH_FONT_DIR is set to '{configured}' but DejaVuSans.ttf is not there.");
        }
        foreach (string folder in StandardFolders)
        {
            if (File.Exists(Path.Combine(folder, "DejaVuSans.ttf")))
            {
                return folder;
            }
        }
        throw new InvalidOperationException(
            "DejaVu fonts not found (looked in " + string.Join(", ", StandardFolders) + "). Install the fonts-dejavu-core package or set RUNWATCH_FONT_DIR.");
    }

    private sealed record LoadedFonts(string Folder, SKTypeface Regular, SKTypeface Bold, SKTypeface Monospace);
}
