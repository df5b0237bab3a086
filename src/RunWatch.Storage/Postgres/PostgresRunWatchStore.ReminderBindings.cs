using Npgsql;

namespace RunWatch.Storage.Postgres;

/// <summary>Reminder role bindings set on the dashboard, each change with its audit entry.</summary>
public sealed partial class PostgresRunWatchStore : IReminderBindingStore
{
    /// <inheritdoc />
    public Task<IReadOnlyList<ReminderBinding>> GetReminderBindingsAsync(CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<ReminderBinding>>(async connection =>
        {
            await using var command = new NpgsqlCommand(
                "SELECT chamber, role, channel, updated_us, updated_by FROM reminder_bindings ORDER BY chamber COLLATE \"C\", role COLLATE \"C\"", connection);
            await using var r = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
            var list = new List<ReminderBinding>();
            while (await r.ReadAsync(cancellationToken).ConfigureAwait(false))
            {
                list.Add(new ReminderBinding(r.GetString(0), r.GetString(1), r.IsDBNull(2) ? null : r.GetString(2),
                    UnixMicros.ToDateTimeOffset(r.GetInt64(3)), r.GetString(4)));
            }
            return list;
        }, cancellationToken);

    /// <inheritdoc />
    public Task SaveReminderBindingAsync(ReminderBinding binding, AuditEntry audit, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(binding);
        ArgumentNullException.ThrowIfNull(audit);
        return WriteAsync(async (connection, transaction) =>
        {
            await using var upsert = new NpgsqlCommand("""
                INSERT INTO reminder_bindings (chamber, role, channel, updated_us, updated_by) VALUES (@chamber, @role, @channel, @t, @by)
                ON CONFLICT (chamber, role) DO UPDATE SET channel = excluded.channel, updated_us = excluded.updated_us, updated_by = excluded.updated_by
                """, connection, transaction);
            PgParameters.Text(upsert, "chamber", binding.Chamber);
            PgParameters.Text(upsert, "role", binding.Role);
            PgParameters.Text(upsert, "channel", binding.Channel);
            PgParameters.Micros(upsert, "t", binding.UpdatedAt);
            PgParameters.Text(upsert, "by", binding.UpdatedBy);
            await upsert.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false);
            await InsertAuditAsync(connection, transaction, audit, cancellationToken).ConfigureAwait(false);
            return 0;
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<bool> RemoveReminderBindingAsync(string chamber, string role, AuditEntry audit, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(audit);
        return WriteAsync(async (connection, transaction) =>
        {
            await using var delete = new NpgsqlCommand("DELETE FROM reminder_bindings WHERE chamber = @chamber AND role = @role", connection, transaction);
            PgParameters.Text(delete, "chamber", chamber);
            PgParameters.Text(delete, "role", role);
            if (await delete.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false) == 0)
            {
                return false;
            }
            await InsertAuditAsync(connection, transaction, audit, cancellationToken).ConfigureAwait(false);
            return true;
        }, cancellationToken);
    }
}
