using System.Globalization;
using System.Text;
using Npgsql;

namespace RunWatch.Storage.Postgres;

/// <summary>Commit notifications: after each batch, other instances learn which sample ranges became visible.</summary>
public sealed partial class PostgresRunWatchStore
{
    /// <summary>PostgreSQL channel the store NOTIFYs on after a batch that stored new samples.</summary>
    public const string CommitChannel = "runwatch_samples";

    // PostgreSQL refuses a payload of 8000 bytes or more; stay well below it and send several notifications if needed.
    internal const int MaxPayloadBytes = 7500;

    private readonly Dictionary<(long ChamberId, long ChannelId), (long From, long To)> _notifyRanges = [];
    private readonly StringBuilder _notifyPayload = new();

    /// <summary>Random tag of this store instance, sent with its notifications so its own listener can skip them.</summary>
    internal string NotifySource { get; } = Guid.NewGuid().ToString("N");

    // Sent inside the batch's transaction: PostgreSQL delivers it only on commit, so a listener never hears of a
    // sample that was rolled back. The payload names ranges, not samples (a batch of 1000 would not fit in 8000
    // bytes); listeners read the samples from the store. Runs under the ingest lock (the dictionary is reused).
    private async Task NotifyCommittedAsync(NpgsqlConnection connection, NpgsqlTransaction transaction, IngestBatch batch, CancellationToken cancellationToken)
    {
        _notifyRanges.Clear();
        ReadOnlySpan<SampleRow> samples = batch.Samples;
        ReadOnlySpan<bool> inserted = batch.Inserted;
        for (int i = 0; i < samples.Length; i++)
        {
            if (!inserted[i])
            {
                continue;
            }
            var key = (samples[i].ChamberId, samples[i].ChannelId);
            long t = samples[i].TimestampUs;
            _notifyRanges[key] = _notifyRanges.TryGetValue(key, out var range)
                ? (Math.Min(range.From, t), Math.Max(range.To, t))
                : (t, t);
        }

        _notifyPayload.Clear().Append(NotifySource);
        int entries = 0;
        foreach (var ((chamber, channel), (from, to)) in _notifyRanges)
        {
            string entry = string.Create(CultureInfo.InvariantCulture, $";{chamber},{channel},{from},{to}");
            if (entries > 0 && _notifyPayload.Length + entry.Length > MaxPayloadBytes)
            {
                await SendNotifyAsync(connection, transaction, cancellationToken).ConfigureAwait(false);
                _notifyPayload.Clear().Append(NotifySource);
                entries = 0;
            }
            _notifyPayload.Append(entry);
            entries++;
        }
        if (entries > 0)
        {
            await SendNotifyAsync(connection, transaction, cancellationToken).ConfigureAwait(false);
        }
    }

    private async Task SendNotifyAsync(NpgsqlConnection connection, NpgsqlTransaction transaction, CancellationToken cancellationToken)
    {
        await using var command = new NpgsqlCommand("SELECT pg_notify(@channel, @payload)", connection, transaction);
        PgParameters.Text(command, "channel", CommitChannel);
        PgParameters.Text(command, "payload", _notifyPayload.ToString());
        await command.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false);
    }

    /// <summary>Reads the samples of a committed range with chamber and channel names, for a commit listener.</summary>
    internal Task<CommittedSamples?> ReadCommittedAsync(long chamberId, long channelId, long fromUs, long toUs, int maxCount, CancellationToken cancellationToken) =>
        ReadAsync<CommittedSamples?>(async connection =>
        {
            await using var names = new NpgsqlCommand(
                "SELECT c.name, ch.name FROM channels ch JOIN chambers c ON c.id = ch.chamber_id WHERE ch.id = @ch AND c.id = @c",
                connection);
            PgParameters.Long(names, "c", chamberId);
            PgParameters.Long(names, "ch", channelId);
            string chamber;
            string channel;
            await using (var reader = await names.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false))
            {
                if (!await reader.ReadAsync(cancellationToken).ConfigureAwait(false))
                {
                    return null;
                }
                chamber = reader.GetString(0);
                channel = reader.GetString(1);
            }
            await using var command = new NpgsqlCommand("""
                SELECT t_us, seq, value FROM samples
                WHERE chamber_id = @c AND channel_id = @ch AND t_us >= @from AND t_us <= @to
                ORDER BY t_us, seq LIMIT @limit
                """, connection);
            PgParameters.Long(command, "c", chamberId);
            PgParameters.Long(command, "ch", channelId);
            PgParameters.Long(command, "from", fromUs);
            PgParameters.Long(command, "to", toUs);
            PgParameters.Int(command, "limit", maxCount);
            var samples = new List<SampleRecord>();
            await using var rows = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
            while (await rows.ReadAsync(cancellationToken).ConfigureAwait(false))
            {
                samples.Add(new SampleRecord(UnixMicros.ToDateTimeOffset(rows.GetInt64(0)), rows.GetInt64(1), rows.GetDouble(2)));
            }
            return new CommittedSamples(chamber, channel, samples);
        }, cancellationToken);
}
