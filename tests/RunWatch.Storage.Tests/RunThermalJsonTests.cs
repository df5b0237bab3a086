using RunWatch.Core.Excursions;
using RunWatch.Core.Thermal;

namespace RunWatch.Storage.Tests;

/// <summary>The run's typed thermal summary and excursions: stored once, read back by every room without JSON.</summary>
public sealed class RunThermalJsonTests
{
    private static readonly DateTimeOffset T0 = new(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);

    [Fact]
    public async Task SaveRunAsync_TypedSummaryAndExcursions_RoundTripThroughTheStore()
    {
        using var db = new TempDatabase();
        await db.Store.MigrateAsync(CancellationToken.None);
        await db.Store.RegisterChambersAsync([TempDatabase.Chamber()], CancellationToken.None);
        var summary = new RunThermalSummary(4, 1.25e-9, 590, 10, 600, 1, false, 0.0123, 601, true, null);
        RunExcursionRecord[] excursions =
        [
            new(T0.AddSeconds(5), T0.AddSeconds(8), 3, -21.5, 578.5, ExcursionSeverity.Alarm, 0, Closed: true, InGrowthWindow: false, SuppressedByDesign: true),
            new(T0.AddSeconds(100), T0.AddSeconds(130), 30, 7.25, 607.25, ExcursionSeverity.Warning, 1.5, Closed: false, InGrowthWindow: true),
        ];

        var saved = await db.Store.SaveRunAsync(new RunRecord
        {
            Chamber = "C1", Name = "R-1", StartedAt = T0, EndedAt = T0.AddSeconds(600), Status = RunStatus.Closed, Summary = summary, Excursions = excursions,
        }, CancellationToken.None);
        var back = await db.Store.GetRunAsync(saved.Id, CancellationToken.None);

        Assert.Equal(summary, back!.Summary);
        Assert.Equal(excursions, back.Excursions);
        Assert.Equal(4, RunThermalSummary.ConventionFactorOf(back));
        Assert.Equal(new GrowthWindow(10, 600), RunThermalSummary.GrowthWindowOf(back));
    }

    [Fact]
    public void ReadExcursions_TextWrittenBeforeTheSuppressionFlag_ReadsAsNotSuppressed()
    {
        const string Stored = """[{"start":"2026-03-04T10:03:21Z","end":"2026-03-04T10:03:49Z","durationS":28,"peakDeviationK":12,"peakValueC":612,"severity":"Warning","lengthChangeNm":3.1,"closed":true,"inGrowthWindow":true}]""";

        var excursion = Assert.Single(RunThermalJson.ReadExcursions(Stored)!);

        Assert.False(excursion.SuppressedByDesign);
    }

    [Fact]
    public void ReadExcursions_TextWrittenBeforeTheWindowFlag_ReadsAsClosedAndInsideTheWindow()
    {
        // The form the runs table held before excursions carried "inGrowthWindow" (they were then all shown as inside).
        const string Stored = """[{"start":"2026-03-04T10:03:21Z","end":"2026-03-04T10:03:49Z","durationS":28,"peakDeviationK":12,"peakValueC":612,"severity":"Warning","lengthChangeNm":3.1}]""";

        var excursion = Assert.Single(RunThermalJson.ReadExcursions(Stored)!);

        Assert.Equal(new RunExcursionRecord(T0.AddSeconds(201), T0.AddSeconds(229), 28, 12, 612, ExcursionSeverity.Warning, 3.1, Closed: true, InGrowthWindow: true), excursion);
        Assert.Equal([excursion], RunThermalJson.ReadExcursions(RunThermalJson.Write([excursion])));
    }

    [Theory]
    [InlineData("{\"conventionFactor\":")]
    [InlineData("{\"conventionFactor\":\"four\"}")]
    public void ReadSummary_UnreadableText_SaysSoInsteadOfThrowing(string stored)
    {
        RunThermalSummary summary = RunThermalJson.ReadSummary(stored)!;

        Assert.StartsWith("the stored summary cannot be read", summary.Error, StringComparison.Ordinal);
    }

    [Fact]
    public void ConventionFactorOf_RunWithoutSummary_TheOneDefault()
    {
        var run = new RunRecord { Chamber = "C1", Name = "R-0", StartedAt = T0 };

        Assert.Equal(DiffusionLengthOptions.DefaultConventionFactor, RunThermalSummary.ConventionFactorOf(run));
        Assert.Equal(DiffusionLengthOptions.DefaultConventionFactor, RunThermalSummary.ConventionFactorOf(null));
        Assert.Equal(DiffusionLengthOptions.DefaultConventionFactor, new DiffusionLengthOptions().ConventionFactor);
    }
}
