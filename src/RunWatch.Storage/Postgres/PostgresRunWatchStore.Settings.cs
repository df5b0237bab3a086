using System.Text.Json;
using Npgsql;
using RunWatch.Core.Qc;

namespace RunWatch.Storage.Postgres;

/// <summary>Editable settings (QC specifications, reminder thresholds) and audit reads.</summary>
public sealed partial class PostgresRunWatchStore
{
    /// <inheritdoc />
    public Task<IReadOnlyList<AuditEntry>> GetAuditAsync(int maxCount, CancellationToken cancellationToken)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(maxCount);
        return ReadAsync<IReadOnlyList<AuditEntry>>(async connection =>
        {
            await using var command = new NpgsqlCommand("SELECT at_us, actor, action, subject, detail_json FROM audit_entries ORDER BY at_us DESC, id DESC LIMIT @n", connection);
            PgParameters.Int(command, "n", maxCount);
            await using var r = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
            var list = new List<AuditEntry>();
            while (await r.ReadAsync(cancellationToken).ConfigureAwait(false))
            {
                list.Add(new AuditEntry(UnixMicros.ToDateTimeOffset(r.GetInt64(0)), r.GetString(1), r.GetString(2),
                    r.IsDBNull(3) ? null : r.GetString(3), r.IsDBNull(4) ? null : r.GetString(4)));
            }
            return list;
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<IReadOnlyList<StoredQcSpecification>> GetQcSpecificationsAsync(CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<StoredQcSpecification>>(async connection =>
        {
            await using var command = new NpgsqlCommand("SELECT recipe, spec_json, updated_us, updated_by FROM qc_specifications ORDER BY recipe COLLATE \"C\"", connection);
            await using var r = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
            var list = new List<StoredQcSpecification>();
            while (await r.ReadAsync(cancellationToken).ConfigureAwait(false))
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
        return WriteAsync(async (connection, transaction) =>
        {
            int added = 0;
            foreach (var (recipe, spec) in specifications.OrderBy(kv => kv.Key, StringComparer.Ordinal))
            {
                await using var insert = new NpgsqlCommand("""
                    INSERT INTO qc_specifications (recipe, spec_json, updated_us, updated_by) VALUES (@recipe, @json, @t, @by)
                    ON CONFLICT (recipe) DO NOTHING
                    """, connection, transaction);
                PgParameters.Text(insert, "recipe", recipe);
                PgParameters.Text(insert, "json", JsonSerializer.Serialize(spec, SettingsJsonContext.Default.QcSpecification));
                PgParameters.Micros(insert, "t", at);
                PgParameters.Text(insert, "by", actor);
                if (await insert.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false) == 1)
                {
                    added++;
                    await InsertAuditAsync(connection, transaction, new AuditEntry(at, actor, "spec seeded", SpecSubject(recipe),
                        AuditDetail.Json("initial value from configuration")), cancellationToken).ConfigureAwait(false);
                }
            }
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
        return WriteAsync(async (connection, transaction) =>
        {
            await using var update = new NpgsqlCommand(
                "UPDATE qc_specifications SET spec_json = @json, updated_us = @t, updated_by = @by WHERE recipe = @recipe"
                + (expectedUpdatedAt is null ? "" : " AND updated_us = @expected"), connection, transaction);
            PgParameters.Text(update, "recipe", recipe);
            PgParameters.Micros(update, "expected", expectedUpdatedAt);
            PgParameters.Text(update, "json", JsonSerializer.Serialize(specification, SettingsJsonContext.Default.QcSpecification));
            PgParameters.Micros(update, "t", audit.At);
            PgParameters.Text(update, "by", actor);
            if (await update.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false) == 0)
            {
                await using var exists = new NpgsqlCommand("SELECT updated_by FROM qc_specifications WHERE recipe = @recipe", connection, transaction);
                PgParameters.Text(exists, "recipe", recipe);
                throw await exists.ExecuteScalarAsync(cancellationToken).ConfigureAwait(false) is string by
                    ? new InvalidOperationException($"Not saved: the specification of {SpecSubject(recipe)} was changed meanwhile by {by}; reload it and edit again.")
                    : new KeyNotFoundException($"No stored QC specification for {SpecSubject(recipe)}.");
            }
            await InsertAuditAsync(connection, transaction, audit, cancellationToken).ConfigureAwait(false);
            return 0;
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<IReadOnlyList<ReminderSetting>> GetReminderSettingsAsync(CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<ReminderSetting>>(async connection =>
        {
            await using var command = new NpgsqlCommand(
                "SELECT rule_id, threshold, unit, window_s, updated_us, updated_by FROM reminder_settings ORDER BY rule_id COLLATE \"C\"", connection);
            await using var r = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
            var list = new List<ReminderSetting>();
            while (await r.ReadAsync(cancellationToken).ConfigureAwait(false))
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
        return WriteAsync(async (connection, transaction) =>
        {
            int added = 0;
            foreach (ReminderSetting s in settings)
            {
                await using var insert = new NpgsqlCommand("""
                    INSERT INTO reminder_settings (rule_id, threshold, unit, window_s, updated_us, updated_by)
                    VALUES (@id, @threshold, @unit, @window, @t, @by) ON CONFLICT (rule_id) DO NOTHING
                    """, connection, transaction);
                AddReminderParameters(insert, s);
                added += await insert.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false);
            }
            return added;
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task SaveReminderSettingAsync(ReminderSetting setting, AuditEntry audit, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(setting);
        ArgumentNullException.ThrowIfNull(audit);
        return WriteAsync(async (connection, transaction) =>
        {
            await using var update = new NpgsqlCommand("""
                UPDATE reminder_settings SET threshold = @threshold, unit = @unit, window_s = @window, updated_us = @t, updated_by = @by
                WHERE rule_id = @id
                """, connection, transaction);
            AddReminderParameters(update, setting);
            if (await update.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false) == 0)
            {
                throw new KeyNotFoundException($"No stored setting for reminder rule '{setting.RuleId}'.");
            }
            await InsertAuditAsync(connection, transaction, audit, cancellationToken).ConfigureAwait(false);
            return 0;
        }, cancellationToken);
    }

    private static string SpecSubject(string recipe) =>
        recipe.Length == 0 ? "the default specification" : "recipe " + recipe;

    private static void AddReminderParameters(NpgsqlCommand command, ReminderSetting s)
    {
        PgParameters.Text(command, "id", s.RuleId);
        PgParameters.Double(command, "threshold", s.Threshold);
        PgParameters.Text(command, "unit", s.Unit);
        PgParameters.Double(command, "window", s.Window.TotalSeconds);
        PgParameters.Micros(command, "t", s.UpdatedAt);
        PgParameters.Text(command, "by", s.UpdatedBy);
    }
}
