using System.Text.Json;
using RunWatch.Commands;
using RunWatch.Imaging.Analysis;
using RunWatch.Simulation.Sem;
using Xunit;

namespace RunWatch.Tests.Commands;

public sealed class AnalyzeCommandTests : IDisposable
{
    private readonly string _folder = Path.Combine(Path.GetTempPath(), "runwatch-analyze-" + Guid.NewGuid().ToString("N"));

    public AnalyzeCommandTests() => Directory.CreateDirectory(_folder);

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    private string Field(string name, int seed)
    {
        IReadOnlyList<(double X, double Y)> sites = SemSites.Scatter(400, 270, 120, 24, 0.05, 13, seed, 1);
        SemField field = SemFieldGenerator.Generate(new SemFieldSpec { Width = 400, Height = 300, Seed = seed, Sites = sites, InfoStripRows = 30, PixelSizeNm = 5 });
        string path = Path.Combine(_folder, name);
        SemFieldWriter.Write(field, path, waferId: "W-TEST-1");
        return path;
    }

    [Fact]
    public void Run_TwoFieldsWithAllOutputs_WritesSummaryCsvOverlaysAndProgress()
    {
        string a = Field("a.png", 1), b = Field("b.png", 2);
        string csv = Path.Combine(_folder, "wires.csv"), overlay = Path.Combine(_folder, "overlay.png");
        var stdout = new StringWriter();
        var stderr = new StringWriter();
        int code = AnalyzeCommand.Run([a, b], new FieldAnalysisOptions { DiffusionLengthNm = 80, KeepZoneMap = true }, json: false, csv, overlay, stdout, stderr);
        Assert.Equal(0, code);
        Assert.Contains("a.png  (PNG, 16 bit, 400 × 300, pixel 5 nm from sidecar)", stdout.ToString());
        Assert.Contains("wafer W-TEST-1", stdout.ToString());
        Assert.Contains("[2/2] b.png", stderr.ToString());
        string[] lines = File.ReadAllLines(csv);
        Assert.StartsWith("field,id,class", lines[0]);
        Assert.Contains(lines, l => l.StartsWith("b.png,", StringComparison.Ordinal));
        Assert.True(File.Exists(Path.Combine(_folder, "overlay-a.png")));
        Assert.True(File.Exists(Path.Combine(_folder, "overlay-b.png")));
    }

    [Fact]
    public void Run_Json_IsParseableAndCountsMatchCsv()
    {
        string a = Field("a.png", 3);
        string csv = Path.Combine(_folder, "wires.csv");
        var stdout = new StringWriter();
        Assert.Equal(0, AnalyzeCommand.Run([a], new FieldAnalysisOptions(), json: true, csv, null, stdout, new StringWriter()));
        using JsonDocument doc = JsonDocument.Parse(stdout.ToString());
        JsonElement field = doc.RootElement.GetProperty("fields")[0];
        Assert.Equal("runwatch-analysis/1", doc.RootElement.GetProperty("format").GetString());
        Assert.Equal(File.ReadAllLines(csv).Length - 1, field.GetProperty("wires").GetArrayLength());
        Assert.Equal("otsu", field.GetProperty("thresholdMethod").GetString());
    }

    [Fact]
    public void Run_MissingAndDamagedImages_ExitNonZeroAndAnalyseTheRest()
    {
        string good = Field("good.png", 4);
        string damaged = Path.Combine(_folder, "damaged.png");
        byte[] bytes = File.ReadAllBytes(good);
        File.WriteAllBytes(damaged, bytes[..(bytes.Length / 2)]);
        var stdout = new StringWriter();
        var stderr = new StringWriter();
        int code = AnalyzeCommand.Run([good, damaged, Path.Combine(_folder, "absent.tif")], new FieldAnalysisOptions(), false, null, null, stdout, stderr);
        Assert.Equal(AnalyzeCommand.BadInputExitCode, code);
        Assert.Contains("good.png  (PNG", stdout.ToString());
        Assert.Matches(@"damaged\.png: .*truncated", stderr.ToString());
        Assert.Contains("absent.tif: cannot open the file", stderr.ToString());
        Assert.Contains("analysed 1 of 3 images; 2 could not be read", stderr.ToString());
    }

    [Fact]
    public void Parse_NegativePixelSize_ExitsWithMessage()
    {
        string a = Field("a.png", 5);
        var error = new StringWriter();
        TextWriter saved = Console.Error;
        Console.SetError(error);
        try
        {
            int code = CommandCatalog.Build().Parse(["analyze", a, "--pixel-size-nm", "-3"]).Invoke();
            Assert.Equal(AnalyzeCommand.BadInputExitCode, code);
        }
        finally
        {
            Console.SetError(saved);
        }
        Assert.Contains("--pixel-size-nm must lie between 0.001 and 100000 nm, got -3", error.ToString());
    }
}
