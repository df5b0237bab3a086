namespace RunWatch.Storage.Tests.Contract;

/// <summary>The <see cref="IRunWatchStore"/> contract: every test body runs against SQLite and PostgreSQL.</summary>
public sealed class RunWatchStoreContractTests
{
    private static readonly DateTimeOffset T0 = new(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);

    [Theory]
    [AllStores]
    public async Task WriteBatchAsync_SameSamplesTwice_StoresEachOnce(StoreKind kind)
    {
        await using var db = await StoreUnderTest.CreateAsync(kind);
        var chamber = await RegisterAsync(db);
        var batch = new IngestBatch(4);
        for (int i = 0; i < 100; i++)
        {
            batch.AddSample(new SampleRow(chamber.ChamberId, chamber.Channels[0].ChannelId, UnixMicros.From(T0.AddSeconds(i)), i, 600 + (i * 0.1)));
        }

        var first = await db.Store.WriteBatchAsync(batch, CancellationToken.None);
        var second = await db.Store.WriteBatchAsync(batch, CancellationToken.None);

        Assert.Equal(100, first.SamplesInserted);
        Assert.Equal(0, first.SampleDuplicates);
        Assert.Equal(0, second.SamplesInserted);
        Assert.Equal(100, second.SampleDuplicates);
        Assert.All(batch.Inserted.ToArray(), Assert.False);
        Assert.Equal(100, await db.CountAsync("SELECT COUNT(*) FROM samples"));
    }

    [Theory]
    [AllStores]
    public async Task WriteBatchAsync_SameTimestampDifferentSeq_KeepsBoth(StoreKind kind)
    {
        await using var db = await StoreUnderTest.CreateAsync(kind);
        var chamber = await RegisterAsync(db);
        var batch = new IngestBatch();
        long t = UnixMicros.From(T0);
        batch.AddSample(new SampleRow(chamber.ChamberId, chamber.Channels[0].ChannelId, t, 1, 600));
        batch.AddSample(new SampleRow(chamber.ChamberId, chamber.Channels[0].ChannelId, t, 2, 601));
        batch.AddSample(new SampleRow(chamber.ChamberId, chamber.Channels[1].ChannelId, t, 1, 610));
        batch.AddSample(new SampleRow(chamber.ChamberId, chamber.Channels[0].ChannelId, t, 1, 999));

        var result = await db.Store.WriteBatchAsync(batch, CancellationToken.None);

        Assert.Equal(3, result.SamplesInserted);
        Assert.Equal(new[] { true, true, true, false }, batch.Inserted.ToArray());
        var read = await db.Store.GetSamplesAsync("C1", "substrate_tc", T0, T0.AddSeconds(1), 10, CancellationToken.None);
        Assert.Equal(new[] { 600.0, 601.0 }, read.Select(s => s.Value).ToArray());
    }

    [Theory]
    [AllStores]
    public async Task WriteBatchAsync_LargeBatchWithSomeRedelivered_MarksExactlyTheNewRowsInserted(StoreKind kind)
    {
        // 300 rows cross several multi-row chunks and a tail; every third was stored by an earlier batch, and the
        // last row repeats the first one within the batch. Expected flags are computed here, row by row.
        await using var db = await StoreUnderTest.CreateAsync(kind);
        var chamber = await RegisterAsync(db);
        long channel = chamber.Channels[0].ChannelId;
        var earlier = new IngestBatch();
        for (int i = 0; i < 300; i += 3)
        {
            earlier.AddSample(new SampleRow(chamber.ChamberId, channel, UnixMicros.From(T0.AddSeconds(i)), i, 600));
        }
        await db.Store.WriteBatchAsync(earlier, CancellationToken.None);
        var batch = new IngestBatch();
        var expected = new List<bool>();
        for (int i = 0; i < 300; i++)
        {
            batch.AddSample(new SampleRow(chamber.ChamberId, channel, UnixMicros.From(T0.AddSeconds(i)), i, 601));
            expected.Add(i % 3 != 0);
        }
        batch.AddSample(new SampleRow(chamber.ChamberId, channel, UnixMicros.From(T0.AddSeconds(1)), 1, 602));
        expected.Add(false);

        var result = await db.Store.WriteBatchAsync(batch, CancellationToken.None);

        Assert.Equal(200, result.SamplesInserted);
        Assert.Equal(101, result.SampleDuplicates);
        Assert.Equal(expected.ToArray(), batch.Inserted.ToArray());
        Assert.Equal(300, await db.CountAsync("SELECT COUNT(*) FROM samples"));
        Assert.Equal(100, await db.CountAsync("SELECT COUNT(*) FROM samples WHERE value = 600"));
    }

    [Theory]
    [AllStores]
    public async Task WriteBatchAsync_AllNewAcrossChunksAndTail_StoresEveryRowWithItsValue(StoreKind kind)
    {
        await using var db = await StoreUnderTest.CreateAsync(kind);
        var chamber = await RegisterAsync(db);
        var batch = new IngestBatch();
        for (int i = 0; i < 1000; i++)
        {
            batch.AddSample(new SampleRow(chamber.ChamberId, chamber.Channels[i % 2].ChannelId, UnixMicros.From(T0.AddMilliseconds(i * 100)), i, i * 0.5));
        }

        var result = await db.Store.WriteBatchAsync(batch, CancellationToken.None);

        Assert.Equal(1000, result.SamplesInserted);
        Assert.All(batch.Inserted.ToArray(), Assert.True);
        var read = await db.Store.GetSamplesAsync("C1", "substrate_tc", T0, T0.AddSeconds(100), 2000, CancellationToken.None);
        Assert.Equal(Enumerable.Range(0, 500).Select(k => (2 * k) * 0.5).ToArray(), read.Select(s => s.Value).ToArray());
        Assert.Equal(Enumerable.Range(0, 500).Select(k => (long)(2 * k)).ToArray(), read.Select(s => s.Seq).ToArray());
    }

    [Theory]
    [AllStores]
    public async Task GetSamplesAsync_Range_ReturnsHalfOpenIntervalInOrder(StoreKind kind)
    {
        await using var db = await StoreUnderTest.CreateAsync(kind);
        var chamber = await RegisterAsync(db);
        var batch = new IngestBatch();
        for (int i = 9; i >= 0; i--)
        {
            batch.AddSample(new SampleRow(chamber.ChamberId, chamber.Channels[0].ChannelId, UnixMicros.From(T0.AddSeconds(i)), SampleRow.NoSeq, i));
        }
        await db.Store.WriteBatchAsync(batch, CancellationToken.None);

        var read = await db.Store.GetSamplesAsync("C1", "substrate_tc", T0.AddSeconds(2), T0.AddSeconds(5), 100, CancellationToken.None);

        Assert.Equal(new[] { 2.0, 3.0, 4.0 }, read.Select(s => s.Value).ToArray());
        Assert.Equal(T0.AddSeconds(2), read[0].Timestamp);
        await Assert.ThrowsAsync<KeyNotFoundException>(() => db.Store.GetSamplesAsync("C1", "nope", T0, T0, 1, CancellationToken.None));
    }

    [Theory]
    [AllStores]
    public async Task WriteBatchAsync_ManyDeadLetters_KeepsOnlyTheNewestUpToTheLimit(StoreKind kind)
    {
        await using var db = await StoreUnderTest.CreateAsync(kind, o => { o.DeadLetterLimit = 5; o.DeadLetterPayloadBytes = 3; });
        await db.Store.MigrateAsync(CancellationToken.None);
        var batch = new IngestBatch();
        for (int i = 0; i < 12; i++)
        {
            batch.DeadLetters.Add(new DeadLetter(T0, "runwatch/lab/C1/telemetry", "malformed_json", "#" + i, new byte[] { 1, 2, 3, 4, 5 }, 5));
        }

        await db.Store.WriteBatchAsync(batch, CancellationToken.None);
        var letters = await db.Store.GetDeadLettersAsync(100, CancellationToken.None);

        Assert.Equal(5, letters.Count);
        Assert.Equal("#11", letters[0].Letter.Detail);
        Assert.Equal(3, letters[0].Letter.Payload.Length);
        Assert.Equal(5, letters[0].Letter.PayloadLength);
    }

    [Theory]
    [AllStores]
    public async Task WriteBatchAsync_EventTwice_StoresOnce(StoreKind kind)
    {
        await using var db = await StoreUnderTest.CreateAsync(kind);
        var chamber = await RegisterAsync(db);
        var batch = new IngestBatch();
        batch.Events.Add(new EventRecord(chamber.ChamberId, T0, "run-start", "R1", null, "{}"));

        var first = await db.Store.WriteBatchAsync(batch, CancellationToken.None);
        var second = await db.Store.WriteBatchAsync(batch, CancellationToken.None);

        Assert.Equal(1, first.EventsInserted);
        Assert.Equal(1, second.EventDuplicates);
        var events = await db.Store.GetEventsAsync("C1", T0, T0.AddSeconds(1), CancellationToken.None);
        Assert.Equal("R1", Assert.Single(events).RunName);
    }

    [Theory]
    [AllStores]
    public async Task SaveRunAsync_InsertThenClose_RoundTripsAndLeavesOpenList(StoreKind kind)
    {
        await using var db = await StoreUnderTest.CreateAsync(kind);
        await RegisterAsync(db);
        var run = await db.Store.SaveRunAsync(new RunRecord
        {
            Chamber = "C1", Name = "R0412", Source = RunSource.Events, Status = RunStatus.Open, StartedAt = T0,
            Wafers = ["W-0412-A"], SetpointC = 610, PlannedSeconds = 1800, Recipe = "nw-std",
        }, CancellationToken.None);
        Assert.NotEqual(0, run.Id);
        Assert.Single(await db.Store.GetOpenRunsAsync(CancellationToken.None));

        await db.Store.SaveRunAsync(run with { Status = RunStatus.Closed, EndReason = RunEndReason.Timeout, EndedAt = T0.AddHours(1), LEffNm = 123.5 }, CancellationToken.None);

        var read = await db.Store.GetRunAsync(run.Id, CancellationToken.None);
        Assert.NotNull(read);
        Assert.Equal(RunEndReason.Timeout, read.EndReason);
        Assert.Equal(123.5, read.LEffNm);
        Assert.Equal(["W-0412-A"], read.Wafers);
        Assert.Empty(await db.Store.GetOpenRunsAsync(CancellationToken.None));
        Assert.Single(await db.Store.ListRunsAsync("C1", null, 10, CancellationToken.None));
        Assert.Empty(await db.Store.ListRunsAsync("C1", T0, 10, CancellationToken.None));
    }

    [Theory]
    [AllStores]
    public async Task SaveAlertAsync_Lifecycle_MovesFromActiveToHistory(StoreKind kind)
    {
        await using var db = await StoreUnderTest.CreateAsync(kind);
        await db.Store.MigrateAsync(CancellationToken.None);
        var alert = await db.Store.SaveAlertAsync(new AlertRecord
        {
            Key = "excursion-high/C1", Chamber = "C1", Kind = "excursion-high", Severity = AlertSeverity.High,
            State = AlertState.Unacknowledged, Message = "test", RaisedAt = T0, UpdatedAt = T0,
        }, CancellationToken.None);
        Assert.Single(await db.Store.GetActiveAlertsAsync(CancellationToken.None));

        await db.Store.SaveAlertAsync(alert with { State = AlertState.Normal, ClearedAt = T0.AddMinutes(1), AcknowledgedAt = T0.AddMinutes(2), AcknowledgedBy = "operator", UpdatedAt = T0.AddMinutes(2) }, CancellationToken.None);

        Assert.Empty(await db.Store.GetActiveAlertsAsync(CancellationToken.None));
        var history = await db.Store.GetAlertHistoryAsync(T0, T0.AddDays(1), 10, CancellationToken.None);
        Assert.Equal(AlertState.Normal, Assert.Single(history).State);
        Assert.Equal("operator", history[0].AcknowledgedBy);
    }

    [Theory]
    [AllStores]
    public async Task PruneAsync_OldRows_DeletedInStepsNewKept(StoreKind kind)
    {
        await using var db = await StoreUnderTest.CreateAsync(kind);
        var chamber = await RegisterAsync(db);
        var batch = new IngestBatch();
        for (int i = 0; i < 25; i++)
        {
            batch.AddSample(new SampleRow(chamber.ChamberId, chamber.Channels[0].ChannelId, UnixMicros.From(T0.AddDays(i)), SampleRow.NoSeq, i));
        }
        await db.Store.WriteBatchAsync(batch, CancellationToken.None);

        var result = await db.Store.PruneAsync(new RetentionPolicy(T0.AddDays(20), T0, T0, MaxRowsPerStep: 7), CancellationToken.None);

        Assert.Equal(20, result.Samples);
        Assert.Equal(5, await db.CountAsync("SELECT COUNT(*) FROM samples"));
    }

    private static async Task<RegisteredChamber> RegisterAsync(StoreUnderTest db)
    {
        await db.Store.MigrateAsync(CancellationToken.None);
        var chambers = await db.Store.RegisterChambersAsync([TempDatabase.Chamber()], CancellationToken.None);
        var again = await db.Store.RegisterChambersAsync([TempDatabase.Chamber()], CancellationToken.None);
        Assert.Equal(chambers[0].Channels[0].ChannelId, again[0].Channels[0].ChannelId);
        return chambers[0];
    }
}
