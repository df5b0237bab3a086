using System.Globalization;
using Microsoft.Data.Sqlite;

namespace RunWatch.Storage.Sqlite;

/// <summary>Alerts, audit entries and retention.</summary>
public sealed partial class SqliteRunWatchStore
{
    private const string AlertColumns = """
        id, alert_key, chamber, run_id, kind, severity, state, message, raised_us, acknowledged_us, acknowledged_by,
        cleared_us, updated_us, peak_value, detail_json
        """;

    /// <inheritdoc />
    public Task<AlertRecord> SaveAlertAsync(AlertRecord alert, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(alert);
        return WriteAsync(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = alert.Id == 0
                ? """
                  INSERT INTO alerts (alert_key, chamber, run_id, kind, severity, state, message, raised_us, acknowledged_us,
                      acknowledged_by, cleared_us, updated_us, peak_value, detail_json)
                  VALUES ($key, $chamber, $run, $kind, $severity, $state, $message, $raised, $acked, $acked_by, $cleared, $updated, $peak, $detail)
                  RETURNING id
                  """
                : """
                  UPDATE alerts SET alert_key = $key, chamber = $chamber, run_id = $run, kind = $kind, severity = $severity,
                      state = $state, message = $message, raised_us = $raised, acknowledged_us = $acked, acknowledged_by = $acked_by,
                      cleared_us = $cleared, updated_us = $updated, peak_value = $peak, detail_json = $detail
                  WHERE id = $id
                  RETURNING id
                  """;
            var p = command.Parameters;
            p.AddWithValue("$id", alert.Id);
            p.AddWithValue("$key", alert.Key);
            p.AddWithValue("$chamber", (object?)alert.Chamber ?? DBNull.Value);
            p.AddWithValue("$run", (object?)alert.RunId ?? DBNull.Value);
            p.AddWithValue("$kind", alert.Kind);
            p.AddWithValue("$severity", alert.Severity.ToString());
            p.AddWithValue("$state", StateName(alert.State));
            p.AddWithValue("$message", alert.Message);
            p.AddWithValue("$raised", UnixMicros.From(alert.RaisedAt));
            p.AddWithValue("$acked", alert.AcknowledgedAt is { } acked ? UnixMicros.From(acked) : DBNull.Value);
            p.AddWithValue("$acked_by", (object?)alert.AcknowledgedBy ?? DBNull.Value);
            p.AddWithValue("$cleared", alert.ClearedAt is { } cleared ? UnixMicros.From(cleared) : DBNull.Value);
            p.AddWithValue("$updated", UnixMicros.From(alert.UpdatedAt));
            p.AddWithValue("$peak", (object?)alert.PeakValue ?? DBNull.Value);
            p.AddWithValue("$detail", (object?)alert.DetailJson ?? DBNull.Value);
            object? id = command.ExecuteScalar();
            if (id is null)
            {
                throw new KeyNotFoundException("No alert with id " + alert.Id.ToString(CultureInfo.InvariantCulture));
            }
            return alert with { Id = Convert.ToInt64(id, CultureInfo.InvariantCulture) };
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<AlertRecord?> GetAlertAsync(long id, CancellationToken cancellationToken) =>
        ReadAsync(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = "SELECT " + AlertColumns + " FROM alerts WHERE id = $id";
            command.Parameters.AddWithValue("$id", id);
            using var reader = command.ExecuteReader();
            return reader.Read() ? ReadAlert(reader) : null;
        }, cancellationToken);

    /// <inheritdoc />
    public Task<IReadOnlyList<AlertRecord>> GetActiveAlertsAsync(CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<AlertRecord>>(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = "SELECT " + AlertColumns + " FROM alerts WHERE state <> 'normal' ORDER BY raised_us DESC, id DESC";
            return ReadAlerts(command);
        }, cancellationToken);

    /// <inheritdoc />
    public Task<IReadOnlyList<AlertRecord>> GetAlertHistoryAsync(DateTimeOffset from, DateTimeOffset to, int maxCount, CancellationToken cancellationToken)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(maxCount);
        return ReadAsync<IReadOnlyList<AlertRecord>>(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = "SELECT " + AlertColumns + " FROM alerts WHERE raised_us >= $from AND raised_us < $to ORDER BY raised_us DESC, id DESC LIMIT $limit";
            command.Parameters.AddWithValue("$from", UnixMicros.From(from));
            command.Parameters.AddWithValue("$to", UnixMicros.From(to));
            command.Parameters.AddWithValue("$limit", maxCount);
            return ReadAlerts(command);
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task AppendAuditAsync(AuditEntry entry, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(entry);
        return WriteAsync(connection =>
        {
            InsertAudit(connection, null, entry);
            return 1;
        }, cancellationToken);
    }

    /// <inheritdoc />
    public async Task<PruneResult> PruneAsync(RetentionPolicy policy, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(policy);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(policy.MaxRowsPerStep);
        long samples = await DeleteInStepsAsync(
            "DELETE FROM samples WHERE (chamber_id, channel_id, t_us, seq) IN (SELECT chamber_id, channel_id, t_us, seq FROM samples WHERE t_us < $cutoff LIMIT $limit)",
            policy.SamplesBefore, policy.MaxRowsPerStep, cancellationToken).ConfigureAwait(false);
        long letters = await DeleteInStepsAsync(
            "DELETE FROM dead_letters WHERE id IN (SELECT id FROM dead_letters WHERE received_us < $cutoff LIMIT $limit)",
            policy.DeadLettersBefore, policy.MaxRowsPerStep, cancellationToken).ConfigureAwait(false);
        long alerts = await DeleteInStepsAsync(
            "DELETE FROM alerts WHERE id IN (SELECT id FROM alerts WHERE state = 'normal' AND updated_us < $cutoff LIMIT $limit)",
            policy.NormalAlertsBefore, policy.MaxRowsPerStep, cancellationToken).ConfigureAwait(false);
        var result = new PruneResult(samples, letters, alerts);
        if (samples + letters + alerts > 0)
        {
            Log.Pruned(_logger, samples, letters, alerts);
        }
        return result;
    }

    private async Task<long> DeleteInStepsAsync(string sql, DateTimeOffset cutoff, int maxRowsPerStep, CancellationToken cancellationToken)
    {
        long total = 0;
        while (true)
        {
            int deleted = await WriteAsync(connection =>
            {
                using var command = connection.CreateCommand();
                command.CommandText = sql;
                command.Parameters.AddWithValue("$cutoff", UnixMicros.From(cutoff));
                command.Parameters.AddWithValue("$limit", maxRowsPerStep);
                return command.ExecuteNonQuery();
            }, cancellationToken, countsAsWrite: false).ConfigureAwait(false);
            total += deleted;
            if (deleted < maxRowsPerStep)
            {
                return total;
            }
        }
    }

    private static List<AlertRecord> ReadAlerts(SqliteCommand command)
    {
        var result = new List<AlertRecord>();
        using var reader = command.ExecuteReader();
        while (reader.Read())
        {
            result.Add(ReadAlert(reader));
        }
        return result;
    }

    private static AlertRecord ReadAlert(SqliteDataReader r) => new()
    {
        Id = r.GetInt64(0),
        Key = r.GetString(1),
        Chamber = r.IsDBNull(2) ? null : r.GetString(2),
        RunId = r.IsDBNull(3) ? null : r.GetInt64(3),
        Kind = r.GetString(4),
        Severity = Enum.Parse<AlertSeverity>(r.GetString(5)),
        State = ParseState(r.GetString(6)),
        Message = r.GetString(7),
        RaisedAt = UnixMicros.ToDateTimeOffset(r.GetInt64(8)),
        AcknowledgedAt = r.IsDBNull(9) ? null : UnixMicros.ToDateTimeOffset(r.GetInt64(9)),
        AcknowledgedBy = r.IsDBNull(10) ? null : r.GetString(10),
        ClearedAt = r.IsDBNull(11) ? null : UnixMicros.ToDateTimeOffset(r.GetInt64(11)),
        UpdatedAt = UnixMicros.ToDateTimeOffset(r.GetInt64(12)),
        PeakValue = r.IsDBNull(13) ? null : r.GetDouble(13),
        DetailJson = r.IsDBNull(14) ? null : r.GetString(14),
    };

    private static string StateName(AlertState state) => state switch
    {
        AlertState.Normal => "normal",
        AlertState.Unacknowledged => "unacknowledged",
        AlertState.Acknowledged => "acknowledged",
        AlertState.ReturnedUnacknowledged => "returned-unacknowledged",
        AlertState.Shelved => "shelved",
        AlertState.Suppressed => "suppressed",
        _ => throw new ArgumentOutOfRangeException(nameof(state), state, null),
    };

    private static AlertState ParseState(string name) => name switch
    {
        "normal" => AlertState.Normal,
        "unacknowledged" => AlertState.Unacknowledged,
        "acknowledged" => AlertState.Acknowledged,
        "returned-unacknowledged" => AlertState.ReturnedUnacknowledged,
        "suppressed" => AlertState.Suppressed,
        "shelved" => AlertState.Shelved,
        _ => throw new InvalidDataException("Unknown alert state in store: " + name),
    };
}
