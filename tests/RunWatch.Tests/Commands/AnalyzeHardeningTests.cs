using RunWatch.Commands;
using RunWatch.Imaging.Analysis;
using RunWatch.Simulation.Sem;
using Xunit;

namespace RunWatch.Tests.Commands;

/// <summary><c>runwatch analyze</c> with absurd scales and hostile file names: clear errors, guarded CSV cells.</summary>
public sealed class AnalyzeHardeningTests : IDisposable
{
    private readonly string _folder = Directory.CreateTempSubdirectory("runwatch-analyze-hard-").FullName;

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    [Theory]
    [InlineData("1e308")]
    [InlineData("1e-300")]
    public void Run_SidecarPixelSizeOutsideRange_ClearErrorNamingFileAndFieldNoStackTrace(string value)
    {
        string image = Field("a.png");
        File.WriteAllText(image + ".field.json", "{\"format\":\"runwatch-field/1\",\"pixelSizeNm\":" + value + "}");
        var stderr = new StringWriter();

        int code = AnalyzeCommand.Run([image], new FieldAnalysisOptions(), json: false, null, null, new StringWriter(), stderr);

        Assert.NotEqual(0, code);
        Assert.Contains("a.png.field.json: pixelSizeNm must lie between", stderr.ToString(), StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", stderr.ToString(), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("1e308")]
    [InlineData("1e-300")]
    public void Cli_PixelSizeOptionOutsideRange_RefusedBeforeAnalysis(string value)
    {
        string image = Field("a.png");
        var run = CommandRun.Invoke("analyze", image, "--pixel-size-nm", value);
        Assert.NotEqual(0, run.ExitCode);
    }

    [Theory]
    [InlineData("=cmd.png")]
    [InlineData("+sum.png")]
    [InlineData("-x.png")]
    [InlineData("@at.png")]
    public void Run_CsvOfFileNameStartingWithFormulaCharacter_CellGuarded(string name)
    {
        string image = Field(name);
        string csv = Path.Combine(_folder, "wires.csv");

        Assert.Equal(0, AnalyzeCommand.Run([image], new FieldAnalysisOptions(), json: false, csv, null, new StringWriter(), new StringWriter()));

        string[] rows = File.ReadAllLines(csv)[1..];
        Assert.NotEmpty(rows);
        // OWASP CSV injection guidance (COMMON PRACTICE): the cell starts with an apostrophe, never with the formula character.
        Assert.All(rows, r => Assert.StartsWith("'" + name + ",", r, StringComparison.Ordinal));
    }

    private string Field(string name)
    {
        IReadOnlyList<(double X, double Y)> sites = SemSites.Scatter(400, 270, 120, 24, 0.05, 13, 5, 1);
        SemField field = SemFieldGenerator.Generate(new SemFieldSpec { Width = 400, Height = 300, Seed = 5, Sites = sites, InfoStripRows = 30, PixelSizeNm = 5 });
        string path = Path.Combine(_folder, name);
        SemFieldWriter.Write(field, path, waferId: "W-TEST-1");
        return path;
    }
}
