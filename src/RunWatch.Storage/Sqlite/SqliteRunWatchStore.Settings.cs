using System.Globalization;
using System.Text.Json;
using Microsoft.Data.Sqlite;
using RunWatch.Core.Qc;

namespace RunWatch.Storage.Sqlite;

/// <summary>Editable settings (QC specifications, reminder thresholds) and audit reads.</summary>
public sealed partial class SqliteRunWatchStore : ISettingsStore
{
    /// <inheritdoc />
    public Task<IReadOnlyList<AuditEntry>> GetAuditAsync(int maxCount, CancellationToken cancellationToken)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(maxCount);
        return ReadAsync<IReadOnlyList<AuditEntry>>(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = "SELECT at_us, actor, action, subject, detail_json FROM audit_entries ORDER BY at_us DESC, id DESC LIMIT $n";
            command.Parameters.AddWithValue("$n", maxCount);
            using var r = command.ExecuteReader();
            var list = new List<AuditEntry>();
            while (r.Read())
            {
                list.Add(new AuditEntry(UnixMicros.ToDateTimeOffset(r.GetInt64(0)), r.GetString(1), r.GetString(2),
                    r.IsDBNull(3) ? null : r.GetString(3), r.IsDBNull(4) ? null : r.GetString(4)));
            }
            return list;
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<IReadOnlyList<StoredQcSpecification>> GetQcSpecificationsAsync(CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<StoredQcSpecification>>(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = "SELECT recipe, spec_json, updated_us, updated_by FROM qc_specifications ORDER BY recipe";
            using var r = command.ExecuteReader();
            var list = new List<StoredQcSpecification>();
            while (r.Read())
            {
                var spec = JsonSerializer.Deserialize(r.GetString(1), SettingsJsonContext.Default.QcSpecification)
                    ?? throw new InvalidDataException("Stored QC specification of recipe '" + r.GetString(0) + "' is empty.");
                list.Add(new StoredQcSpecification(r.GetString(0), spec, UnixMicros.ToDateTimeOffset(r.GetInt64(2)), r.GetString(3)));
            }
            return list;
        }, cancellationToken);

    /// <inheritdoc />
    public Task<int> SeedQcSpecificationsAsync(IReadOnlyDictionary<string, QcSpecification> specifications, string actor, DateTimeOffset at, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(specifications);
        ArgumentException.ThrowIfNullOrWhiteSpace(actor);
        return WriteAsync(connection =>
        {
            using var transaction = connection.BeginTransaction();
            int added = 0;
            foreach (var (recipe, spec) in specifications.OrderBy(kv => kv.Key, StringComparer.Ordinal))
            {
                using var insert = connection.CreateCommand();
                insert.Transaction = transaction;
                insert.CommandText = """
                    INSERT INTO qc_specifications (recipe, spec_json, updated_us, updated_by) VALUES ($recipe, $json, $t, $by)
                    ON CONFLICT (recipe) DO NOTHING
                    """;
                insert.Parameters.AddWithValue("$recipe", recipe);
                insert.Parameters.AddWithValue("$json", JsonSerializer.Serialize(spec, SettingsJsonContext.Default.QcSpecification));
                insert.Parameters.AddWithValue("$t", UnixMicros.From(at));
                insert.Parameters.AddWithValue("$by", actor);
                if (insert.ExecuteNonQuery() == 1)
                {
                    added++;
                    InsertAudit(connection, transaction, new AuditEntry(at, actor, "spec seeded", SpecSubject(recipe),
                        AuditDetail.Json("initial value from configuration")));
                }
            }
            transaction.Commit();
            return added;
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task SaveQcSpecificationAsync(string recipe, QcSpecification specification, string actor, AuditEntry audit, DateTimeOffset? expectedUpdatedAt,
        CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(recipe);
        ArgumentNullException.ThrowIfNull(specification);
        ArgumentException.ThrowIfNullOrWhiteSpace(actor);
        ArgumentNullException.ThrowIfNull(audit);
        return WriteAsync(connection =>
        {
            using var transaction = connection.BeginTransaction();
            using var update = connection.CreateCommand();
            update.Transaction = transaction;
            update.CommandText = "UPDATE qc_specifications SET spec_json = $json, updated_us = $t, updated_by = $by WHERE recipe = $recipe"
                + (expectedUpdatedAt is null ? "" : " AND updated_us = $expected");
            update.Parameters.AddWithValue("$recipe", recipe);
            update.Parameters.AddWithValue("$expected", expectedUpdatedAt is { } e ? UnixMicros.From(e) : DBNull.Value);
            update.Parameters.AddWithValue("$json", JsonSerializer.Serialize(specification, SettingsJsonContext.Default.QcSpecification));
            update.Parameters.AddWithValue("$t", UnixMicros.From(audit.At));
            update.Parameters.AddWithValue("$by", actor);
            if (update.ExecuteNonQuery() == 0)
            {
                using var exists = connection.CreateCommand();
                exists.Transaction = transaction;
                exists.CommandText = "SELECT updated_by FROM qc_specifications WHERE recipe = $recipe";
                exists.Parameters.AddWithValue("$recipe", recipe);
                throw exists.ExecuteScalar() is string by
                    ? new InvalidOperationException($"Not saved: the specification of {SpecSubject(recipe)} was changed meanwhile by {by}; reload it and edit again.")
                    : new KeyNotFoundException($"No stored QC specification for {SpecSubject(recipe)}.");
            }
            InsertAudit(connection, transaction, audit);
            transaction.Commit();
            return 0;
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<IReadOnlyList<ReminderSetting>> GetReminderSettingsAsync(CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<ReminderSetting>>(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = "SELECT rule_id, threshold, unit, window_s, updated_us, updated_by FROM reminder_settings ORDER BY rule_id";
            using var r = command.ExecuteReader();
            var list = new List<ReminderSetting>();
            while (r.Read())
            {
                list.Add(new ReminderSetting(r.GetString(0), r.GetDouble(1), r.GetString(2), TimeSpan.FromSeconds(r.GetDouble(3)),
                    UnixMicros.ToDateTimeOffset(r.GetInt64(4)), r.GetString(5)));
            }
            return list;
        }, cancellationToken);

    /// <inheritdoc />
    public Task<int> SeedReminderSettingsAsync(IReadOnlyList<ReminderSetting> settings, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(settings);
        return WriteAsync(connection =>
        {
            using var transaction = connection.BeginTransaction();
            int added = 0;
            foreach (ReminderSetting s in settings)
            {
                using var insert = connection.CreateCommand();
                insert.Transaction = transaction;
                insert.CommandText = """
                    INSERT INTO reminder_settings (rule_id, threshold, unit, window_s, updated_us, updated_by)
                    VALUES ($id, $threshold, $unit, $window, $t, $by) ON CONFLICT (rule_id) DO NOTHING
                    """;
                AddReminderParameters(insert, s);
                added += insert.ExecuteNonQuery();
            }
            transaction.Commit();
            return added;
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task SaveReminderSettingAsync(ReminderSetting setting, AuditEntry audit, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(setting);
        ArgumentNullException.ThrowIfNull(audit);
        return WriteAsync(connection =>
        {
            using var transaction = connection.BeginTransaction();
            using var update = connection.CreateCommand();
            update.Transaction = transaction;
            update.CommandText = """
                UPDATE reminder_settings SET threshold = $threshold, unit = $unit, window_s = $window, updated_us = $t, updated_by = $by
                WHERE rule_id = $id
                """;
            AddReminderParameters(update, setting);
            if (update.ExecuteNonQuery() == 0)
            {
                throw new KeyNotFoundException($"No stored setting for reminder rule '{setting.RuleId}'.");
            }
            InsertAudit(connection, transaction, audit);
            transaction.Commit();
            return 0;
        }, cancellationToken);
    }

    private static string SpecSubject(string recipe) =>
        recipe.Length == 0 ? "the default specification" : "recipe " + recipe;

    private static void AddReminderParameters(SqliteCommand command, ReminderSetting s)
    {
        command.Parameters.AddWithValue("$id", s.RuleId);
        command.Parameters.AddWithValue("$threshold", s.Threshold);
        command.Parameters.AddWithValue("$unit", s.Unit);
        command.Parameters.AddWithValue("$window", s.Window.TotalSeconds);
        command.Parameters.AddWithValue("$t", UnixMicros.From(s.UpdatedAt));
        command.Parameters.AddWithValue("$by", s.UpdatedBy);
    }

    /// <summary>One audit row, inside the caller's transaction when it has one.</summary>
    private static void InsertAudit(SqliteConnection connection, SqliteTransaction? transaction, AuditEntry entry)
    {
        using var command = connection.CreateCommand();
        command.Transaction = transaction;
        command.CommandText = "INSERT INTO audit_entries (at_us, actor, action, subject, detail_json) VALUES ($t, $actor, $action, $subject, $detail)";
        command.Parameters.AddWithValue("$t", UnixMicros.From(entry.At));
        command.Parameters.AddWithValue("$actor", entry.Actor);
        command.Parameters.AddWithValue("$action", entry.Action);
        command.Parameters.AddWithValue("$subject", (object?)entry.Subject ?? DBNull.Value);
        command.Parameters.AddWithValue("$detail", (object?)entry.DetailJson ?? DBNull.Value);
        command.ExecuteNonQuery();
    }
}
