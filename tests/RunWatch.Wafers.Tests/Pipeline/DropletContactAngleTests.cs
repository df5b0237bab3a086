using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Options;
using RunWatch.Core.Qc;
using RunWatch.Core.Wafers;
using RunWatch.Simulation.Sem;
using RunWatch.Storage;
using RunWatch.Storage.Sqlite;
using RunWatch.Wafers.Intake;
using RunWatch.Wafers.Pipeline;
using Xunit.Abstractions;

namespace RunWatch.Wafers.Tests.Pipeline;

/// <summary>
/// The process's droplet contact angle from configuration to the stored wire radii: the <c>Qc</c> section names θ for
/// the run's recipe, the pipeline analyses a generated field (RunWatch.Simulation's microscope-like generator, invented
/// data) where some wires show only their droplet, drawn as spherical caps of radius r_wire / sin θ, and the stored
/// result carries wire radii against the generator's own r_wire (exact geometry, independent of the analyser).
/// </summary>
public sealed class DropletContactAngleTests(ITestOutputHelper output) : IAsyncLifetime
{
    private const double ContactAngleDeg = 125;
    private const string Recipe = "invented-droplet-recipe";
    private readonly string _root = Directory.CreateTempSubdirectory("rw-droplet-").FullName;
    private SqliteRunWatchStore _store = null!;
    private long? _fieldId;

    public async Task InitializeAsync()
    {
        _store = new SqliteRunWatchStore(Options.Create(new StorageOptions { DataDirectory = _root }), TimeProvider.System);
        await _store.MigrateAsync(default);
        await _store.RegisterChambersAsync([new ChamberDefinition("C1", "lab", "invented test chamber", [])], default);
        var start = new DateTimeOffset(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);
        await _store.SaveRunAsync(new RunRecord
        {
            Chamber = "C1", Name = "R-DROP-1", Recipe = Recipe, Wafers = ["W-D1-A"], SetpointC = 600, PlannedSeconds = 600,
            StartedAt = start, EndedAt = start.AddSeconds(600), Status = RunStatus.Closed,
        }, default);
    }

    public Task DisposeAsync()
    {
        _store.Dispose();
        SqliteConnection.ClearAllPools();
        Directory.Delete(_root, recursive: true);
        return Task.CompletedTask;
    }

    private static QcOptions Configured(string? angle)
    {
        var values = new Dictionary<string, string?> { [$"Qc:Recipes:{Recipe}:MinWireCount"] = "10" };
        if (angle is not null)
        {
            values[$"Qc:Recipes:{Recipe}:DropletContactAngleDeg"] = angle;
        }
        IConfiguration configuration = new ConfigurationBuilder().AddInMemoryCollection(values).Build();
        var qc = new QcOptions();
        configuration.GetSection(QcOptions.SectionName).Bind(qc);
        return qc;
    }

    [Theory]
    [InlineData("90")]
    [InlineData("180")]
    [InlineData("45")]
    [InlineData("-130")]
    public void Configuration_ContactAngleOutsidePhysicalRange_IsRefused(string angle)
    {
        IReadOnlyList<string> errors = Configured(angle).Validate();

        Assert.Contains(errors, e => e.Contains("DropletContactAngleDeg", StringComparison.Ordinal));
    }

    [Fact]
    public async Task ConfiguredAngle_ReachesAnalysis_WireRadiusIsDropletTimesSinTheta()
    {
        QcOptions qc = Configured(ContactAngleDeg.ToString(System.Globalization.CultureInfo.InvariantCulture));
        Assert.Empty(qc.Validate());
        var spec = new MicroscopeFieldSpec { Width = 1024, Height = 768, Seed = 71, PixelSizeNm = 10 };
        var scene = new MicroscopeSceneOptions
        {
            Seed = 71, MinRadiusPx = 5, MaxRadiusPx = 10, Units = 260, DropletOnlyFraction = 0.25, VisibleFacetDropletFraction = 0.1, ContactAngleDeg = ContactAngleDeg,
        };
        MicroscopeField field = MicroscopeFieldGenerator.Generate(new MicroscopeFieldSpec
        {
            Width = spec.Width, Height = spec.Height, Seed = spec.Seed, PixelSizeNm = spec.PixelSizeNm, Objects = MicroscopeScene.Build(spec, scene),
        });

        IReadOnlyList<FieldWire> withAngle = await AnalyseAsync(field, qc, "W-D1-A");
        IReadOnlyList<FieldWire> withoutAngle = await AnalyseAsync(field, Configured(null), "W-D1-A");

        // Truth: the generator's bare-droplet wires away from the border, matched to the nearest reported wire.
        double nm = spec.PixelSizeNm;
        var bare = field.Objects.Where(o => o.Kind == SemObjectKind.Vertical && o.Group == 0 && o.OnlyDropletVisible
            && o.X > 20 && o.Y > 20 && o.X < spec.Width - 20 && o.Y < spec.SampleRows - 20).ToList();
        var wireErrors = new List<double>();
        var dropletErrors = new List<double>();
        int unmeasuredWithout = 0, matched = 0;
        foreach (MicroscopeObject truth in bare)
        {
            FieldWire? found = Nearest(withAngle, truth.X * nm, truth.Y * nm, 3 * nm);
            FieldWire? plain = Nearest(withoutAngle, truth.X * nm, truth.Y * nm, 3 * nm);
            if (found?.DropletRadiusNm is not { } droplet || found.RadiusNm >= droplet)
            {
                continue;
            }
            matched++;
            wireErrors.Add((found.RadiusNm / (truth.EquivalentRadius * nm)) - 1);
            dropletErrors.Add((droplet / (truth.DropletRadius * nm)) - 1);
            // The same wire analysed without the angle keeps its droplet radius and no wire radius.
            unmeasuredWithout += plain is not null && double.IsNaN(plain.RadiusNm) && plain.DropletRadiusNm is not null ? 1 : 0;
        }
        double wireMedian = Median(wireErrors), dropletMedian = Median(dropletErrors);
        output.WriteLine($"θ = {ContactAngleDeg}° from configuration: {matched}/{bare.Count} bare droplets found; wire radius median error {wireMedian:+0.0%;-0.0%}, droplet radius {dropletMedian:+0.0%;-0.0%}; without the angle {unmeasuredWithout} of them report no wire radius");
        Assert.True(bare.Count >= 30, $"only {bare.Count} bare droplets drawn");
        Assert.True(matched >= 0.9 * bare.Count, $"{matched} of {bare.Count} bare droplets reported with a wire radius below the droplet's");
        Assert.InRange(wireMedian, -0.03, 0.03);
        Assert.InRange(dropletMedian, -0.03, 0.03);
        Assert.Equal(matched, unmeasuredWithout);
    }

    /// <summary>Takes the field in (or queues it again for a second analysis) and analyses it with the given QC options.</summary>
    private async Task<IReadOnlyList<FieldWire>> AnalyseAsync(MicroscopeField field, QcOptions qc, string wafer)
    {
        var pipeline = Options.Create(new WaferPipelineOptions());
        var storage = Options.Create(new StorageOptions { DataDirectory = _root });
        var queue = new FieldAnalysisQueue(4);
        var intake = new FieldIntake(_store, _store, queue, WaferIdResolver.DefaultPattern, TimeProvider.System);
        if (_fieldId is null)
        {
            string path = Path.Combine(Directory.CreateDirectory(Path.Combine(_root, "drop")).FullName, $"{wafer}_field01.png");
            MicroscopeFieldWriter.Write(field, path, waferId: wafer);
            var info = new FileInfo(path);
            _fieldId = (await intake.TakeInAsync(new ArrivedField(path, Path.GetFileName(path), info.Length, info.LastWriteTimeUtc), default)).Field.Id;
        }
        else
        {
            Assert.Equal(1, await intake.ReanalyseWaferAsync(wafer, "engineer1", default));
        }
        var reports = new WaferReportService(_store, _store, pipeline, Options.Create(qc), storage, TimeProvider.System);
        var analysis = new FieldAnalysisService(queue, _store, reports, pipeline, TimeProvider.System, NullLogger<FieldAnalysisService>.Instance, Options.Create(qc));
        Assert.True(queue.Reader.TryRead(out long id));
        Assert.True((await analysis.AnalyseAsync(id, default)).Ok);
        AnalysisRecord stored = (await _store.GetLatestAnalysisAsync(_fieldId.Value, default))!;
        return FieldResultJson.Read(stored.ResultsJson!).Wires;
    }

    private static FieldWire? Nearest(IReadOnlyList<FieldWire> wires, double x, double y, double within)
    {
        FieldWire? best = null;
        double bestD = within * within;
        foreach (FieldWire w in wires)
        {
            double d = ((w.XNm - x) * (w.XNm - x)) + ((w.YNm - y) * (w.YNm - y));
            if (d < bestD)
            {
                bestD = d;
                best = w;
            }
        }
        return best;
    }

    private static double Median(List<double> values)
    {
        if (values.Count == 0)
        {
            return double.NaN;
        }
        double[] s = [.. values.Order()];
        return s.Length % 2 == 1 ? s[s.Length / 2] : 0.5 * (s[(s.Length / 2) - 1] + s[s.Length / 2]);
    }
}
