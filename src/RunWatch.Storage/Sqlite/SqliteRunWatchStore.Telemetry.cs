using Microsoft.Data.Sqlite;
using SQLitePCL;

namespace RunWatch.Storage.Sqlite;

/// <summary>Samples, events and dead letters.</summary>
public sealed partial class SqliteRunWatchStore
{
    /// <inheritdoc />
    public Task<BatchWriteResult> WriteBatchAsync(IngestBatch batch, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(batch);
        if (batch.IsEmpty)
        {
            return Task.FromResult(default(BatchWriteResult));
        }
        return WriteAsync(connection =>
        {
            using var transaction = connection.BeginTransaction();
            int inserted = InsertSamples(connection, batch);
            int eventsInserted = InsertEvents(connection, transaction, batch.Events);
            int deadLetters = InsertDeadLetters(connection, transaction, batch.DeadLetters);
            transaction.Commit();
            return new BatchWriteResult(inserted, batch.SampleCount - inserted, eventsInserted, batch.Events.Count - eventsInserted, deadLetters);
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<IReadOnlyList<SampleRecord>> GetSamplesAsync(string chamber, string channel, DateTimeOffset from, DateTimeOffset to, int maxCount, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(chamber);
        ArgumentNullException.ThrowIfNull(channel);
        ArgumentOutOfRangeException.ThrowIfNegative(maxCount);
        return ReadAsync<IReadOnlyList<SampleRecord>>(connection =>
        {
            var (chamberId, channelId) = ResolveChannel(connection, chamber, channel);
            using var command = connection.CreateCommand();
            command.CommandText = """
                SELECT t_us, seq, value FROM samples
                WHERE chamber_id = $c AND channel_id = $ch AND t_us >= $from AND t_us < $to
                ORDER BY t_us, seq LIMIT $limit
                """;
            command.Parameters.AddWithValue("$c", chamberId);
            command.Parameters.AddWithValue("$ch", channelId);
            command.Parameters.AddWithValue("$from", UnixMicros.From(from));
            command.Parameters.AddWithValue("$to", UnixMicros.From(to));
            command.Parameters.AddWithValue("$limit", maxCount);
            var result = new List<SampleRecord>();
            using var reader = command.ExecuteReader();
            while (reader.Read())
            {
                result.Add(new SampleRecord(UnixMicros.ToDateTimeOffset(reader.GetInt64(0)), reader.GetInt64(1), reader.GetDouble(2)));
            }
            return result;
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<IReadOnlyList<EventRecord>> GetEventsAsync(string chamber, DateTimeOffset from, DateTimeOffset to, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(chamber);
        return ReadAsync<IReadOnlyList<EventRecord>>(connection =>
        {
            long chamberId = ResolveChamber(connection, chamber);
            using var command = connection.CreateCommand();
            command.CommandText = """
                SELECT t_us, type, run_name, text, payload_json FROM events
                WHERE chamber_id = $c AND t_us >= $from AND t_us < $to ORDER BY t_us, id
                """;
            command.Parameters.AddWithValue("$c", chamberId);
            command.Parameters.AddWithValue("$from", UnixMicros.From(from));
            command.Parameters.AddWithValue("$to", UnixMicros.From(to));
            var result = new List<EventRecord>();
            using var reader = command.ExecuteReader();
            while (reader.Read())
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
        return ReadAsync<IReadOnlyList<DeadLetterRecord>>(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = "SELECT id, received_us, topic, reason, detail, payload, payload_len FROM dead_letters ORDER BY id DESC LIMIT $limit";
            command.Parameters.AddWithValue("$limit", maxCount);
            var result = new List<DeadLetterRecord>();
            using var reader = command.ExecuteReader();
            while (reader.Read())
            {
                byte[] payload = reader.IsDBNull(5) ? [] : (byte[])reader.GetValue(5);
                result.Add(new DeadLetterRecord(reader.GetInt64(0), new DeadLetter(UnixMicros.ToDateTimeOffset(reader.GetInt64(1)), reader.GetString(2),
                    reader.GetString(3), reader.IsDBNull(4) ? null : reader.GetString(4), payload, reader.GetInt32(6))));
            }
            return result;
        }, cancellationToken);
    }

    /// <summary>
    /// Inserts the batch's samples through one statement prepared on the writer connection and bound by position
    /// with SQLite's own calls (SQLitePCLRaw, underneath Microsoft.Data.Sqlite): no boxing of values, no parameter
    /// lookup by name, no allocation per row. The transaction is the caller's. Each row learns whether it was new.
    /// </summary>
    private int InsertSamples(SqliteConnection connection, IngestBatch batch)
    {
        if (batch.SampleCount == 0)
        {
            return 0;
        }
        var db = connection.Handle!;
        var statement = _insertSample ??= PrepareSampleInsert(db);
        var samples = batch.Samples;
        var inserted = batch.InsertedForWrite;
        int count = 0;
        for (int i = 0; i < samples.Length; i++)
        {
            ref readonly var sample = ref samples[i];
            raw.sqlite3_bind_int64(statement, 1, sample.ChamberId);
            raw.sqlite3_bind_int64(statement, 2, sample.ChannelId);
            raw.sqlite3_bind_int64(statement, 3, sample.TimestampUs);
            raw.sqlite3_bind_int64(statement, 4, sample.Seq);
            raw.sqlite3_bind_double(statement, 5, sample.Value);
            int rc = raw.sqlite3_step(statement);
            raw.sqlite3_reset(statement);
            if (rc != raw.SQLITE_DONE)
            {
                throw new SqliteException("sample insert failed: " + raw.sqlite3_errmsg(db).utf8_to_string(), rc);
            }
            bool isNew = raw.sqlite3_changes(db) == 1;
            inserted[i] = isNew;
            if (isNew)
            {
                count++;
            }
        }
        return count;
    }

    private static sqlite3_stmt PrepareSampleInsert(sqlite3 db)
    {
        int rc = raw.sqlite3_prepare_v2(db, "INSERT OR IGNORE INTO samples (chamber_id, channel_id, t_us, seq, value) VALUES (?1, ?2, ?3, ?4, ?5)", out var statement);
        if (rc != raw.SQLITE_OK)
        {
            statement.Dispose();
            throw new SqliteException("cannot prepare the sample insert: " + raw.sqlite3_errmsg(db).utf8_to_string(), rc);
        }
        return statement;
    }

    private static int InsertEvents(SqliteConnection connection, SqliteTransaction transaction, List<EventRecord> events)
    {
        if (events.Count == 0)
        {
            return 0;
        }
        using var command = connection.CreateCommand();
        command.Transaction = transaction;
        command.CommandText = """
            INSERT OR IGNORE INTO events (chamber_id, t_us, type, run_name, text, payload_json)
            VALUES ($c, $t, $type, $run, $text, $payload)
            """;
        var c = command.Parameters.Add("$c", SqliteType.Integer);
        var t = command.Parameters.Add("$t", SqliteType.Integer);
        var type = command.Parameters.Add("$type", SqliteType.Text);
        var run = command.Parameters.Add("$run", SqliteType.Text);
        var text = command.Parameters.Add("$text", SqliteType.Text);
        var payload = command.Parameters.Add("$payload", SqliteType.Text);
        int count = 0;
        foreach (var e in events)
        {
            c.Value = e.ChamberId;
            t.Value = UnixMicros.From(e.Timestamp);
            type.Value = e.Type;
            run.Value = (object?)e.RunName ?? DBNull.Value;
            text.Value = (object?)e.Text ?? DBNull.Value;
            payload.Value = e.PayloadJson;
            count += command.ExecuteNonQuery();
        }
        return count;
    }

    private int InsertDeadLetters(SqliteConnection connection, SqliteTransaction transaction, List<DeadLetter> letters)
    {
        if (letters.Count == 0)
        {
            return 0;
        }
        using (var command = connection.CreateCommand())
        {
            command.Transaction = transaction;
            command.CommandText = """
                INSERT INTO dead_letters (received_us, topic, reason, detail, payload, payload_len)
                VALUES ($t, $topic, $reason, $detail, $payload, $len)
                """;
            var t = command.Parameters.Add("$t", SqliteType.Integer);
            var topic = command.Parameters.Add("$topic", SqliteType.Text);
            var reason = command.Parameters.Add("$reason", SqliteType.Text);
            var detail = command.Parameters.Add("$detail", SqliteType.Text);
            var payload = command.Parameters.Add("$payload", SqliteType.Blob);
            var len = command.Parameters.Add("$len", SqliteType.Integer);
            foreach (var letter in letters)
            {
                var kept = letter.Payload.Length > _options.DeadLetterPayloadBytes ? letter.Payload[.._options.DeadLetterPayloadBytes] : letter.Payload;
                t.Value = UnixMicros.From(letter.ReceivedAt);
                topic.Value = letter.Topic;
                reason.Value = letter.Reason;
                detail.Value = (object?)letter.Detail ?? DBNull.Value;
                payload.Value = kept.ToArray();
                len.Value = letter.PayloadLength;
                command.ExecuteNonQuery();
            }
        }
        using (var trim = connection.CreateCommand())
        {
            // AUTOINCREMENT ids only grow, so the newest DeadLetterLimit rows are those above max(id) - limit.
            trim.Transaction = transaction;
            trim.CommandText = "DELETE FROM dead_letters WHERE id <= (SELECT MAX(id) FROM dead_letters) - $limit";
            trim.Parameters.AddWithValue("$limit", _options.DeadLetterLimit);
            trim.ExecuteNonQuery();
        }
        return letters.Count;
    }

    private long ResolveChamber(SqliteConnection connection, string chamber)
    {
        if (_chamberIds.TryGetValue(chamber, out long id))
        {
            return id;
        }
        using var command = connection.CreateCommand();
        command.CommandText = "SELECT id FROM chambers WHERE name = $n";
        command.Parameters.AddWithValue("$n", chamber);
        object? value = command.ExecuteScalar();
        if (value is not long found)
        {
            throw new KeyNotFoundException("Unknown chamber: " + chamber);
        }
        _chamberIds[chamber] = found;
        return found;
    }

    private (long ChamberId, long ChannelId) ResolveChannel(SqliteConnection connection, string chamber, string channel)
    {
        long chamberId = ResolveChamber(connection, chamber);
        if (_channelIds.TryGetValue((chamberId, channel), out long id))
        {
            return (chamberId, id);
        }
        using var command = connection.CreateCommand();
        command.CommandText = "SELECT id FROM channels WHERE chamber_id = $c AND name = $n";
        command.Parameters.AddWithValue("$c", chamberId);
        command.Parameters.AddWithValue("$n", channel);
        object? value = command.ExecuteScalar();
        if (value is not long found)
        {
            throw new KeyNotFoundException("Unknown channel: " + chamber + "/" + channel);
        }
        _channelIds[(chamberId, channel)] = found;
        return (chamberId, found);
    }
}
