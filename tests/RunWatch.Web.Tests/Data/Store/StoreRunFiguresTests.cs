using Xunit;
using RunWatch.Storage;
using RunWatch.Web.Tests.Support;
using StoredAudit = RunWatch.Storage.AuditEntry;

namespace RunWatch.Web.Tests.Data.Store;

/// <summary>What the runs table and the run and alert screens read from the store: verdicts, prediction, comments.</summary>
public sealed class StoreRunFiguresTests : IDisposable
{
    private static readonly DateTimeOffset Start = new(2026, 4, 1, 8, 0, 0, TimeSpan.Zero);
    private static readonly RunExcursionRecord[] RampAndGrowthExcursions =
    [
        new(new DateTimeOffset(2026, 4, 1, 10, 0, 10, TimeSpan.Zero), new DateTimeOffset(2026, 4, 1, 10, 0, 40, TimeSpan.Zero), 30, -36, 574,
            RunWatch.Core.Excursions.ExcursionSeverity.Alarm, 0, Closed: true, InGrowthWindow: false),
        new(new DateTimeOffset(2026, 4, 1, 10, 5, 0, TimeSpan.Zero), new DateTimeOffset(2026, 4, 1, 10, 5, 9, TimeSpan.Zero), 9, 6, 616,
            RunWatch.Core.Excursions.ExcursionSeverity.Warning, 1.25, Closed: true, InGrowthWindow: true),
    ];

    private readonly StoreHarness _harness = new();

    [Fact]
    public async Task GetRunsAsync_WafersReported_RunShowsTheWorstLatestVerdictAndTheRunItsPrediction()
    {
        var store = _harness.Store;
        await store.RegisterChambersAsync([new ChamberDefinition("inv-1", "lab", "invented chamber", [new ChannelDefinition("substrate_tc", ChannelRole.GrowthTemperature, "degC", null, null, [])])], CancellationToken.None);
        var run = await store.SaveRunAsync(new RunRecord { Chamber = "inv-1", Name = "R-INV-7", StartedAt = Start, EndedAt = Start.AddHours(1), Status = RunStatus.Closed }, CancellationToken.None);
        var other = await store.SaveRunAsync(new RunRecord
        {
            Chamber = "inv-1", Name = "R-INV-8", StartedAt = Start.AddHours(2), Status = RunStatus.Open, LEffNm = 250,
            Excursions = RampAndGrowthExcursions,
        }, CancellationToken.None);
        await store.UpsertWaferAsync("W-A", run.Id, "nw-inv", CancellationToken.None);
        await store.UpsertWaferAsync("W-B", run.Id, "nw-inv", CancellationToken.None);
        // W-A first failed, then passed on re-analysis; W-B warns. The run's verdict is the worst latest one: WARN.
        await store.SaveReportAsync(new WaferReportRecord(0, "W-A", Start.AddHours(3), "fail", "pdf", "a1.pdf", null), CancellationToken.None);
        await store.SaveReportAsync(new WaferReportRecord(0, "W-A", Start.AddHours(4), "pass", "json", "a2.json",
            """{"prediction":{"meanRadiusNm":41.5,"radiusSdNm":5.25,"p05Nm":33.0,"p95Nm":50.5}}"""), CancellationToken.None);
        await store.SaveReportAsync(new WaferReportRecord(0, "W-B", Start.AddHours(3.5), "warn", "json", "b.json",
            """{"prediction":{"meanRadiusNm":40.0,"radiusSdNm":5.0,"p05Nm":32.0,"p95Nm":49.0}}"""), CancellationToken.None);

        var runs = await _harness.Data.GetRunsAsync(CancellationToken.None);
        var detail = await _harness.Data.GetRunAsync("R-INV-7", CancellationToken.None);

        Assert.Equal("WARN", runs.Single(r => r.RunId == "R-INV-7").Verdict);
        Assert.Null(runs.Single(r => r.RunId == other.Name).Verdict);
        Assert.NotNull(detail);
        Assert.Equal("WARN", detail.Summary.Verdict);
        // The newest JSON summary of the run's wafers (W-A at 12:00) carries the prediction.
        Assert.Equal(new RunWatch.Web.Data.RadiusPrediction(41.5, 5.25, 33.0, 50.5), detail.Prediction);
        var eight = await _harness.Data.GetRunAsync("R-INV-8", CancellationToken.None);
        Assert.Null(eight!.Prediction);
        // The ramp excursion is listed but outside the growth window; the one inside changes L_eff by 1.25 / 250 = 0.5 %.
        Assert.Equal([false, true], eight.Excursions.Select(e => e.InGrowthWindow).ToArray());
        Assert.Equal(0.5, eight.Excursions[1].EffectOnLPercent, 1e-12);
    }

    [Fact]
    public async Task GetAlertsAsync_CommentInAudit_AlertCarriesItsNewestComment()
    {
        var store = _harness.Store;
        var alert = await store.SaveAlertAsync(new AlertRecord
        {
            Key = "inv-1/deviation-alarm", Chamber = "inv-1", Kind = "deviation-alarm", Severity = AlertSeverity.High, State = AlertState.Acknowledged,
            Message = "invented alert", RaisedAt = Start, UpdatedAt = Start, AcknowledgedBy = "eng",
        }, CancellationToken.None);
        string subject = "alert " + alert.Id.ToString(System.Globalization.CultureInfo.InvariantCulture);
        await store.AppendAuditAsync(new StoredAudit(Start.AddMinutes(1), "eng", "alert acknowledged (comment)", subject, """{"detail":"first look"}"""), CancellationToken.None);
        await store.AppendAuditAsync(new StoredAudit(Start.AddMinutes(2), "eng", "alert shelved (comment)", subject, """{"detail":"heater swap under way"}"""), CancellationToken.None);

        var alerts = await _harness.Data.GetAlertsAsync(CancellationToken.None);

        Assert.Equal("heater swap under way", alerts.Single(a => a.AlertId == alert.Id.ToString(System.Globalization.CultureInfo.InvariantCulture)).Comment);
    }

    public void Dispose() => _harness.Dispose();
}
