using System.Globalization;
using System.Text;
using Npgsql;
using NpgsqlTypes;

namespace RunWatch.Storage.Postgres;

/// <summary>Samples, events and dead letters.</summary>
public sealed partial class PostgresRunWatchStore
{
    private const int MultiRowChunk = 1000;

    // Joins the rows the INSERT really wrote back to their place in the batch; a key sent twice in one batch is
    // stored once, from its first row (equal keys are inserted in batch order), so the first row is the new one.
    // Rows go in key order so that two daemons writing overlapping batches (a handover) take the index entries in
    // the same order and cannot deadlock.
    private const string ReturnNewOrdinals = """
        ins AS (INSERT INTO samples (chamber_id, channel_id, t_us, seq, value)
                SELECT chamber_id, channel_id, t_us, seq, value FROM v ORDER BY chamber_id, channel_id, t_us, seq, ord
                ON CONFLICT DO NOTHING RETURNING chamber_id, channel_id, t_us, seq)
        SELECT min(v.ord)::bigint FROM ins JOIN v USING (chamber_id, channel_id, t_us, seq) GROUP BY chamber_id, channel_id, t_us, seq
        """;

    private readonly List<long> _unnestChamber = [];
    private readonly List<long> _unnestChannel = [];
    private readonly List<long> _unnestTime = [];
    private readonly List<long> _unnestSeq = [];
    private readonly List<double> _unnestValue = [];
    private NpgsqlCommand? _multiRowCommand;

    /// <inheritdoc />
    public async Task<BatchWriteResult> WriteBatchAsync(IngestBatch batch, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(batch);
        if (batch.IsEmpty)
        {
            return default;
        }
        await _ingestLock.WaitAsync(cancellationToken).ConfigureAwait(false);
        try
        {
            var connection = _ingestConnection ??= await OpenIngestConnectionAsync(cancellationToken).ConfigureAwait(false);
            await using var transaction = await connection.BeginTransactionAsync(cancellationToken).ConfigureAwait(false);
            batch.InsertedForWrite.Clear();
            int inserted = batch.SampleCount == 0 ? 0 : _options.PostgresSampleWrite switch
            {
                PostgresSampleWrite.CopyStaging => await InsertSamplesByCopyAsync(connection, transaction, batch, cancellationToken).ConfigureAwait(false),
                PostgresSampleWrite.MultiRowInsert => await InsertSamplesByMultiRowAsync(connection, transaction, batch, cancellationToken).ConfigureAwait(false),
                _ => await InsertSamplesByUnnestAsync(connection, transaction, batch, cancellationToken).ConfigureAwait(false),
            };
            int eventsInserted = await InsertEventsAsync(connection, transaction, batch.Events, cancellationToken).ConfigureAwait(false);
            int deadLetters = await InsertDeadLettersAsync(connection, transaction, batch.DeadLetters, cancellationToken).ConfigureAwait(false);
            if (inserted > 0)
            {
                await NotifyCommittedAsync(connection, transaction, batch, cancellationToken).ConfigureAwait(false);
            }
            await transaction.CommitAsync(cancellationToken).ConfigureAwait(false);
            return new BatchWriteResult(inserted, batch.SampleCount - inserted, eventsInserted, batch.Events.Count - eventsInserted, deadLetters);
        }
        catch (Exception ex) when (IsStoreFailure(ex))
        {
            PostgresLog.WriteFailed(_logger, (ex as PostgresException)?.SqlState ?? ex.GetType().Name, ex);
            await DropIngestConnectionAsync().ConfigureAwait(false);
            throw new StoreUnavailableException("PostgreSQL write failed: " + ex.Message, ex);
        }
        catch
        {
            // Cancelled or a bug: the connection may be mid-protocol; start clean next time.
            await DropIngestConnectionAsync().ConfigureAwait(false);
            throw;
        }
        finally
        {
            _ingestLock.Release();
        }
    }

    /// <inheritdoc />
    public async Task<IReadOnlyList<SampleRecord>> GetSamplesAsync(string chamber, string channel, DateTimeOffset from, DateTimeOffset to, int maxCount, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(chamber);
        ArgumentNullException.ThrowIfNull(channel);
        ArgumentOutOfRangeException.ThrowIfNegative(maxCount);
        return await ReadAsync<IReadOnlyList<SampleRecord>>(async connection =>
        {
            var (chamberId, channelId) = await ResolveChannelAsync(connection, chamber, channel, cancellationToken).ConfigureAwait(false);
            await using var command = new NpgsqlCommand("""
                SELECT t_us, seq, value FROM samples
                WHERE chamber_id = @c AND channel_id = @ch AND t_us >= @from AND t_us < @to
                ORDER BY t_us, seq LIMIT @limit
                """, connection);
            PgParameters.Long(command, "c", chamberId);
            PgParameters.Long(command, "ch", channelId);
            PgParameters.Micros(command, "from", from);
            PgParameters.Micros(command, "to", to);
            PgParameters.Int(command, "limit", maxCount);
            var result = new List<SampleRecord>();
            await using var reader = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
            while (await reader.ReadAsync(cancellationToken).ConfigureAwait(false))
            {
                result.Add(new SampleRecord(UnixMicros.ToDateTimeOffset(reader.GetInt64(0)), reader.GetInt64(1), reader.GetDouble(2)));
            }
            return result;
        }, cancellationToken).ConfigureAwait(false);
    }

    /// <inheritdoc />
    public Task<IReadOnlyList<EventRecord>> GetEventsAsync(string chamber, DateTimeOffset from, DateTimeOffset to, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(chamber);
        return ReadAsync<IReadOnlyList<EventRecord>>(async connection =>
        {
            long chamberId = await ResolveChamberAsync(connection, chamber, cancellationToken).ConfigureAwait(false);
            await using var command = new NpgsqlCommand("""
                SELECT t_us, type, run_name, text, payload_json FROM events
                WHERE chamber_id = @c AND t_us >= @from AND t_us < @to ORDER BY t_us, id
                """, connection);
            PgParameters.Long(command, "c", chamberId);
            PgParameters.Micros(command, "from", from);
            PgParameters.Micros(command, "to", to);
            var result = new List<EventRecord>();
            await using var reader = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
            while (await reader.ReadAsync(cancellationToken).ConfigureAwait(false))
            {
                result.Add(new EventRecord(chamberId, UnixMicros.ToDateTimeOffset(reader.GetInt64(0)), reader.GetString(1),
                    reader.IsDBNull(2) ? null : reader.GetString(2), reader.IsDBNull(3) ? null : reader.GetString(3), reader.GetString(4)));
            }
            return result;
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<IReadOnlyList<DeadLetterRecord>> GetDeadLettersAsync(int maxCount, CancellationToken cancellationToken)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(maxCount);
        return ReadAsync<IReadOnlyList<DeadLetterRecord>>(async connection =>
        {
            await using var command = new NpgsqlCommand(
                "SELECT id, received_us, topic, reason, detail, payload, payload_len FROM dead_letters ORDER BY id DESC LIMIT @limit", connection);
            PgParameters.Int(command, "limit", maxCount);
            var result = new List<DeadLetterRecord>();
            await using var reader = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
            while (await reader.ReadAsync(cancellationToken).ConfigureAwait(false))
            {
                byte[] payload = reader.IsDBNull(5) ? [] : reader.GetFieldValue<byte[]>(5);
                result.Add(new DeadLetterRecord(reader.GetInt64(0), new DeadLetter(UnixMicros.ToDateTimeOffset(reader.GetInt64(1)), reader.GetString(2),
                    reader.GetString(3), reader.IsDBNull(4) ? null : reader.GetString(4), payload, reader.GetInt32(6))));
            }
            return result;
        }, cancellationToken);
    }

    /// <summary>The batch's columns as five array parameters; one round trip, one statement, any batch size.</summary>
    private async Task<int> InsertSamplesByUnnestAsync(NpgsqlConnection connection, NpgsqlTransaction transaction, IngestBatch batch, CancellationToken cancellationToken)
    {
        _unnestChamber.Clear();
        _unnestChannel.Clear();
        _unnestTime.Clear();
        _unnestSeq.Clear();
        _unnestValue.Clear();
        foreach (ref readonly var sample in batch.Samples)
        {
            _unnestChamber.Add(sample.ChamberId);
            _unnestChannel.Add(sample.ChannelId);
            _unnestTime.Add(sample.TimestampUs);
            _unnestSeq.Add(sample.Seq);
            _unnestValue.Add(sample.Value);
        }
        await using var command = new NpgsqlCommand("""
            WITH v AS (SELECT u.chamber_id, u.channel_id, u.t_us, u.seq, u.value, u.ord - 1 AS ord
                       FROM unnest(@c, @ch, @t, @s, @v) WITH ORDINALITY AS u(chamber_id, channel_id, t_us, seq, value, ord)),
            """ + ReturnNewOrdinals, connection, transaction);
        command.Parameters.Add(new NpgsqlParameter<List<long>>("c", NpgsqlDbType.Array | NpgsqlDbType.Bigint) { TypedValue = _unnestChamber });
        command.Parameters.Add(new NpgsqlParameter<List<long>>("ch", NpgsqlDbType.Array | NpgsqlDbType.Bigint) { TypedValue = _unnestChannel });
        command.Parameters.Add(new NpgsqlParameter<List<long>>("t", NpgsqlDbType.Array | NpgsqlDbType.Bigint) { TypedValue = _unnestTime });
        command.Parameters.Add(new NpgsqlParameter<List<long>>("s", NpgsqlDbType.Array | NpgsqlDbType.Bigint) { TypedValue = _unnestSeq });
        command.Parameters.Add(new NpgsqlParameter<List<double>>("v", NpgsqlDbType.Array | NpgsqlDbType.Double) { TypedValue = _unnestValue });
        return await MarkNewRowsAsync(command, batch, 0, cancellationToken).ConfigureAwait(false);
    }

    /// <summary>Binary COPY into the session's staging table, then one INSERT ... SELECT ... ON CONFLICT DO NOTHING.</summary>
    private static async Task<int> InsertSamplesByCopyAsync(NpgsqlConnection connection, NpgsqlTransaction transaction, IngestBatch batch, CancellationToken cancellationToken)
    {
        var importer = await connection.BeginBinaryImportAsync(
            "COPY sample_staging (ord, chamber_id, channel_id, t_us, seq, value) FROM STDIN (FORMAT BINARY)", cancellationToken).ConfigureAwait(false);
        await using (importer.ConfigureAwait(false))
        {
            for (int i = 0; i < batch.SampleCount; i++)
            {
                var sample = batch.Samples[i];
                await importer.StartRowAsync(cancellationToken).ConfigureAwait(false);
                await importer.WriteAsync(i, NpgsqlDbType.Integer, cancellationToken).ConfigureAwait(false);
                await importer.WriteAsync(sample.ChamberId, NpgsqlDbType.Bigint, cancellationToken).ConfigureAwait(false);
                await importer.WriteAsync(sample.ChannelId, NpgsqlDbType.Bigint, cancellationToken).ConfigureAwait(false);
                await importer.WriteAsync(sample.TimestampUs, NpgsqlDbType.Bigint, cancellationToken).ConfigureAwait(false);
                await importer.WriteAsync(sample.Seq, NpgsqlDbType.Bigint, cancellationToken).ConfigureAwait(false);
                await importer.WriteAsync(sample.Value, NpgsqlDbType.Double, cancellationToken).ConfigureAwait(false);
            }
            await importer.CompleteAsync(cancellationToken).ConfigureAwait(false);
        }
        await using var command = new NpgsqlCommand("WITH v AS (SELECT * FROM sample_staging), " + ReturnNewOrdinals, connection, transaction);
        return await MarkNewRowsAsync(command, batch, 0, cancellationToken).ConfigureAwait(false);
    }

    /// <summary>Multi-row VALUES in chunks of <see cref="MultiRowChunk"/> rows (5 parameters a row; the protocol allows 65,535).</summary>
    private async Task<int> InsertSamplesByMultiRowAsync(NpgsqlConnection connection, NpgsqlTransaction transaction, IngestBatch batch, CancellationToken cancellationToken)
    {
        int total = 0;
        for (int offset = 0; offset < batch.SampleCount; offset += MultiRowChunk)
        {
            int rows = Math.Min(MultiRowChunk, batch.SampleCount - offset);
            NpgsqlCommand command;
            bool cached = rows == MultiRowChunk;
            if (cached)
            {
                command = _multiRowCommand ??= CreateMultiRowCommand(connection, MultiRowChunk);
            }
            else
            {
                command = CreateMultiRowCommand(connection, rows);
            }
            try
            {
                command.Transaction = transaction;
                var parameters = command.Parameters;
                for (int i = 0; i < rows; i++)
                {
                    var sample = batch.Samples[offset + i];
                    ((NpgsqlParameter<long>)parameters[(5 * i) + 0]).TypedValue = sample.ChamberId;
                    ((NpgsqlParameter<long>)parameters[(5 * i) + 1]).TypedValue = sample.ChannelId;
                    ((NpgsqlParameter<long>)parameters[(5 * i) + 2]).TypedValue = sample.TimestampUs;
                    ((NpgsqlParameter<long>)parameters[(5 * i) + 3]).TypedValue = sample.Seq;
                    ((NpgsqlParameter<double>)parameters[(5 * i) + 4]).TypedValue = sample.Value;
                }
                total += await MarkNewRowsAsync(command, batch, offset, cancellationToken).ConfigureAwait(false);
            }
            finally
            {
                if (!cached)
                {
                    await command.DisposeAsync().ConfigureAwait(false);
                }
            }
        }
        return total;
    }

    private static NpgsqlCommand CreateMultiRowCommand(NpgsqlConnection connection, int rows)
    {
        var sql = new StringBuilder("WITH v (ord, chamber_id, channel_id, t_us, seq, value) AS (VALUES ");
        var command = new NpgsqlCommand { Connection = connection };
        for (int i = 0; i < rows; i++)
        {
            int p = (5 * i) + 1;
            sql.Append(CultureInfo.InvariantCulture, $"{(i == 0 ? "" : ",")}({i},${p},${p + 1},${p + 2},${p + 3},${p + 4})");
            command.Parameters.Add(new NpgsqlParameter<long> { NpgsqlDbType = NpgsqlDbType.Bigint });
            command.Parameters.Add(new NpgsqlParameter<long> { NpgsqlDbType = NpgsqlDbType.Bigint });
            command.Parameters.Add(new NpgsqlParameter<long> { NpgsqlDbType = NpgsqlDbType.Bigint });
            command.Parameters.Add(new NpgsqlParameter<long> { NpgsqlDbType = NpgsqlDbType.Bigint });
            command.Parameters.Add(new NpgsqlParameter<double> { NpgsqlDbType = NpgsqlDbType.Double });
        }
        sql.Append("), ").Append(ReturnNewOrdinals);
        command.CommandText = sql.ToString();
        return command;
    }

    /// <summary>Reads the ordinals (0-based within the command's rows) of the rows written and flags them in the batch.</summary>
    private static async Task<int> MarkNewRowsAsync(NpgsqlCommand command, IngestBatch batch, int offset, CancellationToken cancellationToken)
    {
        int count = 0;
        await using var reader = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
        while (await reader.ReadAsync(cancellationToken).ConfigureAwait(false))
        {
            batch.InsertedForWrite[offset + (int)reader.GetInt64(0)] = true;
            count++;
        }
        return count;
    }

    private static async Task<int> InsertEventsAsync(NpgsqlConnection connection, NpgsqlTransaction transaction, List<EventRecord> events, CancellationToken cancellationToken)
    {
        int count = 0;
        foreach (var e in events)
        {
            await using var command = new NpgsqlCommand("""
                INSERT INTO events (chamber_id, t_us, type, run_name, text, payload_json)
                VALUES (@c, @t, @type, @run, @text, @payload) ON CONFLICT DO NOTHING
                """, connection, transaction);
            PgParameters.Long(command, "c", e.ChamberId);
            PgParameters.Micros(command, "t", e.Timestamp);
            PgParameters.Text(command, "type", e.Type);
            PgParameters.Text(command, "run", e.RunName);
            PgParameters.Text(command, "text", e.Text);
            PgParameters.Text(command, "payload", e.PayloadJson);
            count += await command.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false);
        }
        return count;
    }

    private async Task<int> InsertDeadLettersAsync(NpgsqlConnection connection, NpgsqlTransaction transaction, List<DeadLetter> letters, CancellationToken cancellationToken)
    {
        if (letters.Count == 0)
        {
            return 0;
        }
        foreach (var letter in letters)
        {
            var kept = letter.Payload.Length > _options.DeadLetterPayloadBytes ? letter.Payload[.._options.DeadLetterPayloadBytes] : letter.Payload;
            await using var command = new NpgsqlCommand("""
                INSERT INTO dead_letters (received_us, topic, reason, detail, payload, payload_len)
                VALUES (@t, @topic, @reason, @detail, @payload, @len)
                """, connection, transaction);
            PgParameters.Micros(command, "t", letter.ReceivedAt);
            PgParameters.Text(command, "topic", letter.Topic);
            PgParameters.Text(command, "reason", letter.Reason);
            PgParameters.Text(command, "detail", letter.Detail);
            PgParameters.Bytes(command, "payload", kept.ToArray());
            PgParameters.Int(command, "len", letter.PayloadLength);
            await command.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false);
        }
        // Identity values only grow, so the newest DeadLetterLimit rows are those above max(id) - limit.
        await using var trim = new NpgsqlCommand("DELETE FROM dead_letters WHERE id <= (SELECT MAX(id) FROM dead_letters) - @limit", connection, transaction);
        PgParameters.Long(trim, "limit", _options.DeadLetterLimit);
        await trim.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false);
        return letters.Count;
    }

    private async Task<NpgsqlConnection> OpenIngestConnectionAsync(CancellationToken cancellationToken)
    {
        var connection = await _dataSource.OpenConnectionAsync(cancellationToken).ConfigureAwait(false);
        try
        {
            await using var staging = new NpgsqlCommand("""
                CREATE TEMP TABLE IF NOT EXISTS sample_staging (
                    ord integer NOT NULL, chamber_id bigint NOT NULL, channel_id bigint NOT NULL,
                    t_us bigint NOT NULL, seq bigint NOT NULL, value double precision NOT NULL
                ) ON COMMIT DELETE ROWS
                """, connection);
            await staging.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false);
            return connection;
        }
        catch
        {
            await connection.DisposeAsync().ConfigureAwait(false);
            throw;
        }
    }

    private async Task DropIngestConnectionAsync()
    {
        if (_multiRowCommand is not null)
        {
            await _multiRowCommand.DisposeAsync().ConfigureAwait(false);
            _multiRowCommand = null;
        }
        if (_ingestConnection is not null)
        {
            await _ingestConnection.DisposeAsync().ConfigureAwait(false);
            _ingestConnection = null;
        }
    }

    private async Task<long> ResolveChamberAsync(NpgsqlConnection connection, string chamber, CancellationToken cancellationToken)
    {
        if (_chamberIds.TryGetValue(chamber, out long id))
        {
            return id;
        }
        await using var command = new NpgsqlCommand("SELECT id FROM chambers WHERE name = @n", connection);
        PgParameters.Text(command, "n", chamber);
        if (await command.ExecuteScalarAsync(cancellationToken).ConfigureAwait(false) is not long found)
        {
            throw new KeyNotFoundException("Unknown chamber: " + chamber);
        }
        _chamberIds[chamber] = found;
        return found;
    }

    private async Task<(long ChamberId, long ChannelId)> ResolveChannelAsync(NpgsqlConnection connection, string chamber, string channel, CancellationToken cancellationToken)
    {
        long chamberId = await ResolveChamberAsync(connection, chamber, cancellationToken).ConfigureAwait(false);
        if (_channelIds.TryGetValue((chamberId, channel), out long id))
        {
            return (chamberId, id);
        }
        await using var command = new NpgsqlCommand("SELECT id FROM channels WHERE chamber_id = @c AND name = @n", connection);
        PgParameters.Long(command, "c", chamberId);
        PgParameters.Text(command, "n", channel);
        if (await command.ExecuteScalarAsync(cancellationToken).ConfigureAwait(false) is not long found)
        {
            throw new KeyNotFoundException("Unknown channel: " + chamber + "/" + channel);
        }
        _channelIds[(chamberId, channel)] = found;
        return (chamberId, found);
    }
}
