using System.Globalization;
using Npgsql;

namespace RunWatch.Storage.Postgres;

/// <summary>Alerts, audit entries and retention.</summary>
public sealed partial class PostgresRunWatchStore
{
    private const string AlertColumns = """
        id, alert_key, chamber, run_id, kind, severity, state, message, raised_us, acknowledged_us, acknowledged_by,
        cleared_us, updated_us, peak_value, detail_json
        """;

    /// <inheritdoc />
    public Task<AlertRecord> SaveAlertAsync(AlertRecord alert, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(alert);
        return WriteAsync(async (connection, transaction) =>
        {
            await using var command = new NpgsqlCommand(alert.Id == 0
                ? """
                  INSERT INTO alerts (alert_key, chamber, run_id, kind, severity, state, message, raised_us, acknowledged_us,
                      acknowledged_by, cleared_us, updated_us, peak_value, detail_json)
                  VALUES (@key, @chamber, @run, @kind, @severity, @state, @message, @raised, @acked, @acked_by, @cleared, @updated, @peak, @detail)
                  RETURNING id
                  """
                : """
                  UPDATE alerts SET alert_key = @key, chamber = @chamber, run_id = @run, kind = @kind, severity = @severity,
                      state = @state, message = @message, raised_us = @raised, acknowledged_us = @acked, acknowledged_by = @acked_by,
                      cleared_us = @cleared, updated_us = @updated, peak_value = @peak, detail_json = @detail
                  WHERE id = @id
                  RETURNING id
                  """, connection, transaction);
            PgParameters.Long(command, "id", alert.Id);
            PgParameters.Text(command, "key", alert.Key);
            PgParameters.Text(command, "chamber", alert.Chamber);
            PgParameters.Long(command, "run", alert.RunId);
            PgParameters.Text(command, "kind", alert.Kind);
            PgParameters.Text(command, "severity", alert.Severity.ToString());
            PgParameters.Text(command, "state", AlertStateNames.Name(alert.State));
            PgParameters.Text(command, "message", alert.Message);
            PgParameters.Micros(command, "raised", alert.RaisedAt);
            PgParameters.Micros(command, "acked", alert.AcknowledgedAt);
            PgParameters.Text(command, "acked_by", alert.AcknowledgedBy);
            PgParameters.Micros(command, "cleared", alert.ClearedAt);
            PgParameters.Micros(command, "updated", alert.UpdatedAt);
            PgParameters.Double(command, "peak", alert.PeakValue);
            PgParameters.Text(command, "detail", alert.DetailJson);
            object? id = await command.ExecuteScalarAsync(cancellationToken).ConfigureAwait(false);
            if (id is null)
            {
                throw new KeyNotFoundException("No alert with id " + alert.Id.ToString(CultureInfo.InvariantCulture));
            }
            return alert with { Id = (long)id };
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<AlertRecord?> GetAlertAsync(long id, CancellationToken cancellationToken) =>
        ReadAsync(async connection =>
        {
            await using var command = new NpgsqlCommand("SELECT " + AlertColumns + " FROM alerts WHERE id = @id", connection);
            PgParameters.Long(command, "id", id);
            var alerts = await ReadAlertsAsync(command, cancellationToken).ConfigureAwait(false);
            return alerts.Count == 0 ? null : alerts[0];
        }, cancellationToken);

    /// <inheritdoc />
    public Task<IReadOnlyList<AlertRecord>> GetActiveAlertsAsync(CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<AlertRecord>>(async connection =>
        {
            await using var command = new NpgsqlCommand("SELECT " + AlertColumns + " FROM alerts WHERE state <> 'normal' ORDER BY raised_us DESC, id DESC", connection);
            return await ReadAlertsAsync(command, cancellationToken).ConfigureAwait(false);
        }, cancellationToken);

    /// <inheritdoc />
    public Task<IReadOnlyList<AlertRecord>> GetAlertHistoryAsync(DateTimeOffset from, DateTimeOffset to, int maxCount, CancellationToken cancellationToken)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(maxCount);
        return ReadAsync<IReadOnlyList<AlertRecord>>(async connection =>
        {
            await using var command = new NpgsqlCommand(
                "SELECT " + AlertColumns + " FROM alerts WHERE raised_us >= @from AND raised_us < @to ORDER BY raised_us DESC, id DESC LIMIT @limit", connection);
            PgParameters.Micros(command, "from", from);
            PgParameters.Micros(command, "to", to);
            PgParameters.Int(command, "limit", maxCount);
            return await ReadAlertsAsync(command, cancellationToken).ConfigureAwait(false);
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task AppendAuditAsync(AuditEntry entry, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(entry);
        return WriteAsync(async (connection, transaction) =>
        {
            await InsertAuditAsync(connection, transaction, entry, cancellationToken).ConfigureAwait(false);
            return 1;
        }, cancellationToken);
    }

    /// <inheritdoc />
    public async Task<PruneResult> PruneAsync(RetentionPolicy policy, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(policy);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(policy.MaxRowsPerStep);
        long samples = await DeleteInStepsAsync(
            "DELETE FROM samples WHERE ctid = ANY (ARRAY(SELECT ctid FROM samples WHERE t_us < @cutoff LIMIT @limit))",
            policy.SamplesBefore, policy.MaxRowsPerStep, cancellationToken).ConfigureAwait(false);
        long letters = await DeleteInStepsAsync(
            "DELETE FROM dead_letters WHERE id IN (SELECT id FROM dead_letters WHERE received_us < @cutoff LIMIT @limit)",
            policy.DeadLettersBefore, policy.MaxRowsPerStep, cancellationToken).ConfigureAwait(false);
        long alerts = await DeleteInStepsAsync(
            "DELETE FROM alerts WHERE id IN (SELECT id FROM alerts WHERE state = 'normal' AND updated_us < @cutoff LIMIT @limit)",
            policy.NormalAlertsBefore, policy.MaxRowsPerStep, cancellationToken).ConfigureAwait(false);
        var result = new PruneResult(samples, letters, alerts);
        if (samples + letters + alerts > 0)
        {
            PostgresLog.Pruned(_logger, samples, letters, alerts);
        }
        return result;
    }

    private async Task<long> DeleteInStepsAsync(string sql, DateTimeOffset cutoff, int maxRowsPerStep, CancellationToken cancellationToken)
    {
        long total = 0;
        while (true)
        {
            int deleted = await WriteAsync(async (connection, transaction) =>
            {
                await using var command = new NpgsqlCommand(sql, connection, transaction);
                PgParameters.Micros(command, "cutoff", cutoff);
                PgParameters.Int(command, "limit", maxRowsPerStep);
                return await command.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false);
            }, cancellationToken).ConfigureAwait(false);
            total += deleted;
            if (deleted < maxRowsPerStep)
            {
                return total;
            }
        }
    }

    private static async Task<List<AlertRecord>> ReadAlertsAsync(NpgsqlCommand command, CancellationToken cancellationToken)
    {
        var result = new List<AlertRecord>();
        await using var r = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
        while (await r.ReadAsync(cancellationToken).ConfigureAwait(false))
        {
            result.Add(new AlertRecord
            {
                Id = r.GetInt64(0),
                Key = r.GetString(1),
                Chamber = r.IsDBNull(2) ? null : r.GetString(2),
                RunId = r.IsDBNull(3) ? null : r.GetInt64(3),
                Kind = r.GetString(4),
                Severity = Enum.Parse<AlertSeverity>(r.GetString(5)),
                State = AlertStateNames.Parse(r.GetString(6)),
                Message = r.GetString(7),
                RaisedAt = UnixMicros.ToDateTimeOffset(r.GetInt64(8)),
                AcknowledgedAt = r.IsDBNull(9) ? null : UnixMicros.ToDateTimeOffset(r.GetInt64(9)),
                AcknowledgedBy = r.IsDBNull(10) ? null : r.GetString(10),
                ClearedAt = r.IsDBNull(11) ? null : UnixMicros.ToDateTimeOffset(r.GetInt64(11)),
                UpdatedAt = UnixMicros.ToDateTimeOffset(r.GetInt64(12)),
                PeakValue = r.IsDBNull(13) ? null : r.GetDouble(13),
                DetailJson = r.IsDBNull(14) ? null : r.GetString(14),
            });
        }
        return result;
    }

    /// <summary>One audit row inside the caller's transaction.</summary>
    private static async Task InsertAuditAsync(NpgsqlConnection connection, NpgsqlTransaction transaction, AuditEntry entry, CancellationToken cancellationToken)
    {
        await using var command = new NpgsqlCommand(
            "INSERT INTO audit_entries (at_us, actor, action, subject, detail_json) VALUES (@t, @actor, @action, @subject, @detail)", connection, transaction);
        PgParameters.Micros(command, "t", entry.At);
        PgParameters.Text(command, "actor", entry.Actor);
        PgParameters.Text(command, "action", entry.Action);
        PgParameters.Text(command, "subject", entry.Subject);
        PgParameters.Text(command, "detail", entry.DetailJson);
        await command.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false);
    }
}
