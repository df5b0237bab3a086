namespace RunWatch.Storage.Sqlite;

/// <summary>Reminder role bindings set on the dashboard, each change with its audit entry.</summary>
public sealed partial class SqliteRunWatchStore : IReminderBindingStore
{
    /// <inheritdoc />
    public Task<IReadOnlyList<ReminderBinding>> GetReminderBindingsAsync(CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<ReminderBinding>>(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = "SELECT chamber, role, channel, updated_us, updated_by FROM reminder_bindings ORDER BY chamber, role";
            using var r = command.ExecuteReader();
            var list = new List<ReminderBinding>();
            while (r.Read())
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
        return WriteAsync(connection =>
        {
            using var transaction = connection.BeginTransaction();
            using var upsert = connection.CreateCommand();
            upsert.Transaction = transaction;
            upsert.CommandText = """
                INSERT INTO reminder_bindings (chamber, role, channel, updated_us, updated_by) VALUES ($chamber, $role, $channel, $t, $by)
                ON CONFLICT (chamber, role) DO UPDATE SET channel = excluded.channel, updated_us = excluded.updated_us, updated_by = excluded.updated_by
                """;
            upsert.Parameters.AddWithValue("$chamber", binding.Chamber);
            upsert.Parameters.AddWithValue("$role", binding.Role);
            upsert.Parameters.AddWithValue("$channel", (object?)binding.Channel ?? DBNull.Value);
            upsert.Parameters.AddWithValue("$t", UnixMicros.From(binding.UpdatedAt));
            upsert.Parameters.AddWithValue("$by", binding.UpdatedBy);
            upsert.ExecuteNonQuery();
            InsertAudit(connection, transaction, audit);
            transaction.Commit();
            return 0;
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<bool> RemoveReminderBindingAsync(string chamber, string role, AuditEntry audit, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(audit);
        return WriteAsync(connection =>
        {
            using var transaction = connection.BeginTransaction();
            using var delete = connection.CreateCommand();
            delete.Transaction = transaction;
            delete.CommandText = "DELETE FROM reminder_bindings WHERE chamber = $chamber AND role = $role";
            delete.Parameters.AddWithValue("$chamber", chamber);
            delete.Parameters.AddWithValue("$role", role);
            if (delete.ExecuteNonQuery() == 0)
            {
                return false;
            }
            InsertAudit(connection, transaction, audit);
            transaction.Commit();
            return true;
        }, cancellationToken);
    }
}
