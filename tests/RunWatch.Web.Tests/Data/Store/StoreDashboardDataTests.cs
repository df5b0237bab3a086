using Microsoft.Extensions.Options;
using RunWatch.Storage;
using RunWatch.Storage.Sqlite;
using RunWatch.Web.Data.Store;
using Xunit;
using DashboardAlertState = RunWatch.Web.Data.AlertState;

namespace RunWatch.Web.Tests.Data.Store;

/// <summary>The adapter over the daemon's real SQLite store, in a temp folder.</summary>
public sealed class StoreDashboardDataTests : IAsyncLifetime
{
    private readonly string _folder = Directory.CreateTempSubdirectory("runwatch-web-store-").FullName;
    private SqliteRunWatchStore _store = default!;
    private StoreDashboardData _data = default!;
    private RegisteredChamber _chamber = default!;
    private readonly FakeAlertCommands _alerts = new();

    public async Task InitializeAsync()
    {
        _store = new SqliteRunWatchStore(Options.Create(new StorageOptions { DataDirectory = _folder }), TimeProvider.System);
        await _store.MigrateAsync(CancellationToken.None);
        var registered = await _store.RegisterChambersAsync(
        [
            new ChamberDefinition("c1", "invented lab", null,
            [
                new ChannelDefinition("substrate_tc", ChannelRole.GrowthTemperature, "°C", null, null, []),
                new ChannelDefinition("substrate_sp", ChannelRole.Setpoint, "°C", null, null, []),
            ]),
        ], CancellationToken.None);
        _chamber = registered[0];
        _alerts.Store = _store;
        _data = new StoreDashboardData(_store, _alerts, TimeProvider.System, Options.Create(new DashboardOptions()));
    }

    public Task DisposeAsync()
    {
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
        Directory.Delete(_folder, recursive: true);
        return Task.CompletedTask;
    }

    private async Task WriteAsync(string channel, DateTimeOffset start, int count, Func<int, double> value)
    {
        long channelId = _chamber.Channels.Single(c => c.Definition.Name == channel).ChannelId;
        var batch = new IngestBatch();
        for (int i = 0; i < count; i++)
        {
            batch.AddSample(new SampleRow(_chamber.ChamberId, channelId, start.AddMilliseconds(i * 100).ToUnixTimeMilliseconds() * 1000, i, value(i)));
        }
        await _store.WriteBatchAsync(batch, CancellationToken.None);
    }

    [Fact]
    public async Task GetChamberAsync_AfterCommittedSamples_ShowsLatestTemperatureAndSetpoint()
    {
        var start = DateTimeOffset.FromUnixTimeMilliseconds(DateTimeOffset.UtcNow.AddSeconds(-20).ToUnixTimeMilliseconds());
        await WriteAsync("substrate_tc", start, 100, i => 600 + (i * 0.1));
        await WriteAsync("substrate_sp", start, 100, _ => 610);

        var chamber = await _data.GetChamberAsync("c1", CancellationToken.None);
        var samples = await _data.GetSamplesAsync("c1", "substrate_tc", start, start.AddSeconds(9.9), CancellationToken.None);

        Assert.NotNull(chamber);
        Assert.Equal(609.9, chamber.Temperature!.Value, 9);
        Assert.Equal(610, chamber.Setpoint);
        Assert.Equal("substrate_tc", chamber.TemperatureChannel);
        Assert.Equal(100, samples.UnixSeconds.Length);
        Assert.Null(await _data.GetChamberAsync("nowhere", CancellationToken.None));
    }

    [Fact]
    public async Task GetRunsAndAlerts_StoredRecords_MappedToDashboardViews()
    {
        var run = await _store.SaveRunAsync(new RunRecord { Chamber = "c1", Name = "R-1", Recipe = "nw-test", StartedAt = DateTimeOffset.UtcNow.AddMinutes(-5), SetpointC = 610, Wafers = ["W-1"] }, CancellationToken.None);
        var alert = await _store.SaveAlertAsync(new AlertRecord
        {
            Key = "c1/excursion", Chamber = "c1", RunId = run.Id, Kind = "excursion", Severity = Storage.AlertSeverity.High,
            State = Storage.AlertState.Unacknowledged, Message = "substrate 9 K above setpoint", RaisedAt = DateTimeOffset.UtcNow, UpdatedAt = DateTimeOffset.UtcNow,
        }, CancellationToken.None);

        var runs = await _data.GetRunsAsync(CancellationToken.None);
        var chamber = await _data.GetChamberAsync("c1", CancellationToken.None);
        var alerts = await _data.GetAlertsAsync(CancellationToken.None);

        Assert.Equal("R-1", Assert.Single(runs).RunId);
        Assert.Equal("R-1", chamber!.ActiveRun?.RunId);
        var view = Assert.Single(alerts);
        Assert.Equal(DashboardAlertState.ActiveUnacknowledged, view.State);
        Assert.Equal(RunWatch.Web.Data.AlertSeverity.Alarm, view.Severity);
        Assert.Equal("R-1", view.RunId);

        await _data.AcknowledgeAlertAsync(alert.Id.ToString(System.Globalization.CultureInfo.InvariantCulture), "eng", "seen", CancellationToken.None);

        Assert.Equal(("eng", alert.Id), _alerts.LastAcknowledged);
        Assert.Equal(DashboardAlertState.ActiveAcknowledged, Assert.Single(await _data.GetAlertsAsync(CancellationToken.None)).State);
    }

    /// <summary>Stands in for the daemon's alert engine: applies the acknowledgement to the stored alert.</summary>
    private sealed class FakeAlertCommands : IAlertCommands
    {
        public IRunWatchStore Store { get; set; } = default!;

        public (string User, long Id) LastAcknowledged { get; private set; }

        public async Task<bool> AcknowledgeAsync(long alertId, string user, string? comment, CancellationToken cancellationToken)
        {
            var alert = await Store.GetAlertAsync(alertId, cancellationToken);
            if (alert is null)
            {
                return false;
            }
            await Store.SaveAlertAsync(alert with { State = Storage.AlertState.Acknowledged, AcknowledgedBy = user, AcknowledgedAt = DateTimeOffset.UtcNow }, cancellationToken);
            LastAcknowledged = (user, alertId);
            return true;
        }

        public Task<bool> ShelveAsync(long alertId, TimeSpan duration, string user, string? comment, CancellationToken cancellationToken) => Task.FromResult(false);
    }
}
