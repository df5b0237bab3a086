using System.Globalization;
using System.Text.Json;
using Microsoft.Data.Sqlite;

namespace RunWatch.Storage.Sqlite;

/// <summary>The wafer pipeline's tables: wafers, fields, analyses, reports, model fits.</summary>
public sealed partial class SqliteRunWatchStore : IWaferStore
{
    private const string FieldColumns = """
        f.id, w.name, f.file_path, f.relative_path, f.sha256, f.size_bytes, f.width_px, f.height_px, f.nm_per_px,
        f.position_x_mm, f.position_y_mm, f.imported_us, f.status, f.problem, f.metadata_json
        """;

    /// <inheritdoc />
    public Task<WaferRecord> UpsertWaferAsync(string name, long? runId, string? process, CancellationToken cancellationToken)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(name);
        return WriteAsync(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = """
                INSERT INTO wafers (name, run_id, process, created_us) VALUES ($name, $run, $process, $now)
                ON CONFLICT (name) DO UPDATE SET run_id = COALESCE(excluded.run_id, wafers.run_id),
                    process = COALESCE(excluded.process, wafers.process)
                RETURNING id, name, run_id, process, created_us
                """;
            command.Parameters.AddWithValue("$name", name);
            command.Parameters.AddWithValue("$run", (object?)runId ?? DBNull.Value);
            command.Parameters.AddWithValue("$process", (object?)process ?? DBNull.Value);
            command.Parameters.AddWithValue("$now", UnixMicros.From(_timeProvider.GetUtcNow()));
            using var reader = command.ExecuteReader();
            reader.Read();
            return ReadWafer(reader);
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<WaferRecord?> GetWaferAsync(string name, CancellationToken cancellationToken) =>
        ReadAsync(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = "SELECT id, name, run_id, process, created_us FROM wafers WHERE name = $name";
            command.Parameters.AddWithValue("$name", name);
            using var reader = command.ExecuteReader();
            return reader.Read() ? ReadWafer(reader) : null;
        }, cancellationToken);

    /// <inheritdoc />
    public Task<IReadOnlyList<WaferRecord>> ListWafersAsync(int maxCount, CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<WaferRecord>>(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = "SELECT id, name, run_id, process, created_us FROM wafers ORDER BY id DESC LIMIT $n";
            command.Parameters.AddWithValue("$n", maxCount);
            using var reader = command.ExecuteReader();
            var list = new List<WaferRecord>();
            while (reader.Read())
            {
                list.Add(ReadWafer(reader));
            }
            return list;
        }, cancellationToken);

    /// <inheritdoc />
    public async Task<RunRecord?> FindRunOfWaferAsync(string wafer, CancellationToken cancellationToken)
    {
        long? runId = await ReadAsync(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = """
                SELECT r.id FROM runs r, json_each(r.wafers_json) j
                WHERE j.value = $wafer ORDER BY r.started_us DESC LIMIT 1
                """;
            command.Parameters.AddWithValue("$wafer", wafer);
            object? value = command.ExecuteScalar();
            return value is null or DBNull ? (long?)null : Convert.ToInt64(value, CultureInfo.InvariantCulture);
        }, cancellationToken).ConfigureAwait(false);
        return runId is null ? null : await GetRunAsync(runId.Value, cancellationToken).ConfigureAwait(false);
    }

    /// <inheritdoc />
    public Task<(FieldRecord Field, bool Added)> AddFieldAsync(FieldRecord field, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(field);
        return WriteAsync(connection =>
        {
            using var transaction = connection.BeginTransaction();
            long? waferId = field.Wafer is null ? null : EnsureWafer(connection, transaction, field.Wafer);
            using var insert = connection.CreateCommand();
            insert.Transaction = transaction;
            insert.CommandText = """
                INSERT INTO fields (wafer_id, file_path, relative_path, sha256, size_bytes, width_px, height_px, nm_per_px,
                    position_x_mm, position_y_mm, imported_us, status, problem, metadata_json)
                VALUES ($wafer, $path, $rel, $sha, $size, $w, $h, $nm, $px, $py, $imported, $status, $problem, $meta)
                ON CONFLICT (sha256) DO NOTHING
                RETURNING id
                """;
            BindField(insert, field, waferId);
            insert.Parameters.AddWithValue("$path", field.FilePath);
            insert.Parameters.AddWithValue("$rel", field.RelativePath);
            insert.Parameters.AddWithValue("$sha", field.Sha256);
            insert.Parameters.AddWithValue("$imported", UnixMicros.From(field.ImportedAt));
            object? id = insert.ExecuteScalar();
            bool added = id is not null and not DBNull;
            FieldRecord stored = SelectField(connection, transaction, added ? "f.id = $key" : "f.sha256 = $key", added ? id! : field.Sha256)!;
            transaction.Commit();
            return (stored, added);
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<FieldRecord> UpdateFieldAsync(FieldRecord field, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(field);
        return WriteAsync(connection =>
        {
            using var transaction = connection.BeginTransaction();
            long? waferId = field.Wafer is null ? null : EnsureWafer(connection, transaction, field.Wafer);
            using var update = connection.CreateCommand();
            update.Transaction = transaction;
            update.CommandText = """
                UPDATE fields SET wafer_id = $wafer, size_bytes = $size, width_px = $w, height_px = $h, nm_per_px = $nm,
                    position_x_mm = $px, position_y_mm = $py, status = $status, problem = $problem, metadata_json = $meta
                WHERE id = $id
                """;
            BindField(update, field, waferId);
            update.Parameters.AddWithValue("$id", field.Id);
            if (update.ExecuteNonQuery() != 1)
            {
                throw new KeyNotFoundException("no field with id " + field.Id.ToString(CultureInfo.InvariantCulture));
            }
            FieldRecord stored = SelectField(connection, transaction, "f.id = $key", field.Id)!;
            transaction.Commit();
            return stored;
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<FieldRecord?> GetFieldAsync(long id, CancellationToken cancellationToken) =>
        ReadAsync(connection => SelectField(connection, null, "f.id = $key", id), cancellationToken);

    /// <inheritdoc />
    public Task<IReadOnlyList<FieldRecord>> GetFieldsOfWaferAsync(string wafer, CancellationToken cancellationToken) =>
        ReadAsync(connection => SelectFields(connection, "w.name = $key ORDER BY f.id", wafer, int.MaxValue), cancellationToken);

    /// <inheritdoc />
    public Task<IReadOnlyList<FieldRecord>> GetFieldsByStatusAsync(FieldStatus status, int maxCount, CancellationToken cancellationToken) =>
        ReadAsync(connection => SelectFields(connection, "f.status = $key ORDER BY f.id", status.ToString(), maxCount), cancellationToken);

    /// <inheritdoc />
    /// <remarks>SQLite has one writer, so the select and the update inside one write transaction cannot race.</remarks>
    public Task<FieldRecord?> ClaimQueuedFieldAsync(string worker, DateTimeOffset now, TimeSpan lease, CancellationToken cancellationToken)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(worker);
        return WriteAsync(connection =>
        {
            using var transaction = connection.BeginTransaction();
            using var claim = connection.CreateCommand();
            claim.Transaction = transaction;
            claim.CommandText = """
                UPDATE fields SET claimed_by = $worker, claimed_until_us = $until
                WHERE id = (SELECT id FROM fields WHERE status = 'Queued' AND (claimed_until_us IS NULL OR claimed_until_us <= $now) ORDER BY id LIMIT 1)
                RETURNING id
                """;
            claim.Parameters.AddWithValue("$worker", worker);
            claim.Parameters.AddWithValue("$now", UnixMicros.From(now));
            claim.Parameters.AddWithValue("$until", UnixMicros.From(now + lease));
            object? id = claim.ExecuteScalar();
            FieldRecord? field = id is null or DBNull ? null : SelectField(connection, transaction, "f.id = $key", id);
            transaction.Commit();
            return field;
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<bool> ClaimFieldAsync(long fieldId, string worker, DateTimeOffset now, TimeSpan lease, CancellationToken cancellationToken)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(worker);
        return WriteAsync(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = """
                UPDATE fields SET claimed_by = $worker, claimed_until_us = $until
                WHERE id = $id AND status = 'Queued' AND (claimed_until_us IS NULL OR claimed_until_us <= $now OR claimed_by = $worker)
                """;
            command.Parameters.AddWithValue("$id", fieldId);
            command.Parameters.AddWithValue("$worker", worker);
            command.Parameters.AddWithValue("$now", UnixMicros.From(now));
            command.Parameters.AddWithValue("$until", UnixMicros.From(now + lease));
            return command.ExecuteNonQuery() == 1;
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task ReleaseFieldClaimAsync(long fieldId, string worker, CancellationToken cancellationToken) =>
        WriteAsync(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = "UPDATE fields SET claimed_by = NULL, claimed_until_us = NULL WHERE id = $id AND claimed_by = $worker";
            command.Parameters.AddWithValue("$id", fieldId);
            command.Parameters.AddWithValue("$worker", worker);
            return command.ExecuteNonQuery();
        }, cancellationToken);

    /// <inheritdoc />
    public Task<AnalysisRecord> SaveAnalysisAsync(AnalysisRecord analysis, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(analysis);
        return WriteAsync(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = """
                INSERT INTO analyses (field_id, started_us, finished_us, status, wire_count, results_json, diffusion_length_nm, settings_json, problem)
                VALUES ($field, $started, $finished, $status, $wires, $results, $l, $settings, $problem)
                RETURNING id
                """;
            command.Parameters.AddWithValue("$field", analysis.FieldId);
            command.Parameters.AddWithValue("$started", UnixMicros.From(analysis.StartedAt));
            command.Parameters.AddWithValue("$finished", analysis.FinishedAt is { } f ? UnixMicros.From(f) : DBNull.Value);
            command.Parameters.AddWithValue("$status", analysis.Status);
            command.Parameters.AddWithValue("$wires", (object?)analysis.WireCount ?? DBNull.Value);
            command.Parameters.AddWithValue("$results", (object?)analysis.ResultsJson ?? DBNull.Value);
            command.Parameters.AddWithValue("$l", (object?)analysis.DiffusionLengthNm ?? DBNull.Value);
            command.Parameters.AddWithValue("$settings", (object?)analysis.SettingsJson ?? DBNull.Value);
            command.Parameters.AddWithValue("$problem", (object?)analysis.Problem ?? DBNull.Value);
            long id = Convert.ToInt64(command.ExecuteScalar(), CultureInfo.InvariantCulture);
            return analysis with { Id = id };
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<AnalysisRecord?> GetLatestAnalysisAsync(long fieldId, CancellationToken cancellationToken) =>
        ReadAsync(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = """
                SELECT id, field_id, started_us, finished_us, status, wire_count, results_json, diffusion_length_nm, settings_json, problem
                FROM analyses WHERE field_id = $field ORDER BY id DESC LIMIT 1
                """;
            command.Parameters.AddWithValue("$field", fieldId);
            using var r = command.ExecuteReader();
            if (!r.Read())
            {
                return null;
            }
            return new AnalysisRecord
            {
                Id = r.GetInt64(0),
                FieldId = r.GetInt64(1),
                StartedAt = UnixMicros.ToDateTimeOffset(r.GetInt64(2)),
                FinishedAt = r.IsDBNull(3) ? null : UnixMicros.ToDateTimeOffset(r.GetInt64(3)),
                Status = r.GetString(4),
                WireCount = r.IsDBNull(5) ? null : r.GetInt32(5),
                ResultsJson = r.IsDBNull(6) ? null : r.GetString(6),
                DiffusionLengthNm = r.IsDBNull(7) ? null : r.GetDouble(7),
                SettingsJson = r.IsDBNull(8) ? null : r.GetString(8),
                Problem = r.IsDBNull(9) ? null : r.GetString(9),
            };
        }, cancellationToken);

    /// <inheritdoc />
    public Task<WaferReportRecord> SaveReportAsync(WaferReportRecord report, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(report);
        return WriteAsync(connection =>
        {
            using var transaction = connection.BeginTransaction();
            long waferId = EnsureWafer(connection, transaction, report.Wafer);
            using var command = connection.CreateCommand();
            command.Transaction = transaction;
            command.CommandText = """
                INSERT INTO reports (wafer_id, created_us, verdict, format, file_path, summary_json)
                VALUES ($wafer, $created, $verdict, $format, $path, $summary) RETURNING id
                """;
            command.Parameters.AddWithValue("$wafer", waferId);
            command.Parameters.AddWithValue("$created", UnixMicros.From(report.CreatedAt));
            command.Parameters.AddWithValue("$verdict", report.Verdict);
            command.Parameters.AddWithValue("$format", report.Format);
            command.Parameters.AddWithValue("$path", report.FilePath);
            command.Parameters.AddWithValue("$summary", (object?)report.SummaryJson ?? DBNull.Value);
            long id = Convert.ToInt64(command.ExecuteScalar(), CultureInfo.InvariantCulture);
            transaction.Commit();
            return report with { Id = id };
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<IReadOnlyList<WaferReportRecord>> GetReportsAsync(string wafer, CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<WaferReportRecord>>(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = """
                SELECT r.id, w.name, r.created_us, r.verdict, r.format, r.file_path, r.summary_json
                FROM reports r JOIN wafers w ON w.id = r.wafer_id
                WHERE w.name = $wafer AND r.id IN (SELECT MAX(r2.id) FROM reports r2 WHERE r2.wafer_id = w.id GROUP BY r2.format)
                ORDER BY r.id DESC
                """;
            command.Parameters.AddWithValue("$wafer", wafer);
            using var r = command.ExecuteReader();
            var list = new List<WaferReportRecord>();
            while (r.Read())
            {
                list.Add(new WaferReportRecord(r.GetInt64(0), r.GetString(1), UnixMicros.ToDateTimeOffset(r.GetInt64(2)),
                    r.IsDBNull(3) ? "" : r.GetString(3), r.GetString(4), r.GetString(5), r.IsDBNull(6) ? null : r.GetString(6)));
            }
            return list;
        }, cancellationToken);

    /// <inheritdoc />
    public Task<IReadOnlyList<RunWaferVerdict>> GetLatestRunVerdictsAsync(CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<RunWaferVerdict>>(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = """
                SELECT w.run_id, w.name, r.verdict
                FROM reports r JOIN wafers w ON w.id = r.wafer_id
                WHERE w.run_id IS NOT NULL AND r.verdict IS NOT NULL AND r.verdict <> ''
                  AND r.id = (SELECT MAX(r2.id) FROM reports r2 WHERE r2.wafer_id = w.id)
                """;
            using var r = command.ExecuteReader();
            var list = new List<RunWaferVerdict>();
            while (r.Read())
            {
                list.Add(new RunWaferVerdict(r.GetInt64(0), r.GetString(1), r.GetString(2)));
            }
            return list;
        }, cancellationToken);

    /// <inheritdoc />
    public Task<ModelFitRecord> SaveModelFitAsync(ModelFitRecord fit, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(fit);
        return WriteAsync(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = """
                INSERT INTO model_fits (process, model, fitted_us, params_json, r_squared, rmse_nm, wafer_count, wafers_json, accepted_us, accepted_by)
                VALUES ($process, $model, $fitted, $params, $r2, $rmse, $count, $wafers, $accepted, $by) RETURNING id
                """;
            command.Parameters.AddWithValue("$process", fit.Process);
            command.Parameters.AddWithValue("$model", fit.Model);
            command.Parameters.AddWithValue("$fitted", UnixMicros.From(fit.FittedAt));
            command.Parameters.AddWithValue("$params", fit.ParamsJson);
            command.Parameters.AddWithValue("$r2", (object?)fit.RSquared ?? DBNull.Value);
            command.Parameters.AddWithValue("$rmse", (object?)fit.RmseNm ?? DBNull.Value);
            command.Parameters.AddWithValue("$count", fit.Wafers.Count);
            command.Parameters.AddWithValue("$wafers", JsonSerializer.Serialize(fit.Wafers, StorageJsonContext.Default.IReadOnlyListString));
            command.Parameters.AddWithValue("$accepted", fit.AcceptedAt is { } a ? UnixMicros.From(a) : DBNull.Value);
            command.Parameters.AddWithValue("$by", (object?)fit.AcceptedBy ?? DBNull.Value);
            long id = Convert.ToInt64(command.ExecuteScalar(), CultureInfo.InvariantCulture);
            return fit with { Id = id };
        }, cancellationToken);
    }

    /// <inheritdoc />
    public async Task<ModelFitRecord?> AcceptModelFitAsync(long id, string actor, CancellationToken cancellationToken)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(actor);
        int changed = await WriteAsync(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = "UPDATE model_fits SET accepted_us = $now, accepted_by = $actor WHERE id = $id";
            command.Parameters.AddWithValue("$now", UnixMicros.From(_timeProvider.GetUtcNow()));
            command.Parameters.AddWithValue("$actor", actor);
            command.Parameters.AddWithValue("$id", id);
            return command.ExecuteNonQuery();
        }, cancellationToken).ConfigureAwait(false);
        if (changed == 0)
        {
            return null;
        }
        return await ReadAsync(connection => SelectFits(connection, "id = $key", id, 1).FirstOrDefault(), cancellationToken).ConfigureAwait(false);
    }

    /// <inheritdoc />
    public Task<IReadOnlyList<ModelFitRecord>> GetModelFitsAsync(string process, string model, int maxCount, CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<ModelFitRecord>>(connection => SelectFits(connection, "process = $key AND model = $model", process, maxCount, model), cancellationToken);

    private static List<ModelFitRecord> SelectFits(SqliteConnection connection, string where, object key, int maxCount, string? model = null)
    {
        using var command = connection.CreateCommand();
        command.CommandText = $"""
            SELECT id, process, model, fitted_us, params_json, r_squared, rmse_nm, wafers_json, accepted_us, accepted_by
            FROM model_fits WHERE {where} ORDER BY id DESC LIMIT $n
            """;
        command.Parameters.AddWithValue("$key", key);
        command.Parameters.AddWithValue("$n", maxCount);
        if (model is not null)
        {
            command.Parameters.AddWithValue("$model", model);
        }
        using var r = command.ExecuteReader();
        var list = new List<ModelFitRecord>();
        while (r.Read())
        {
            list.Add(new ModelFitRecord
            {
                Id = r.GetInt64(0),
                Process = r.GetString(1),
                Model = r.GetString(2),
                FittedAt = UnixMicros.ToDateTimeOffset(r.GetInt64(3)),
                ParamsJson = r.GetString(4),
                RSquared = r.IsDBNull(5) ? null : r.GetDouble(5),
                RmseNm = r.IsDBNull(6) ? null : r.GetDouble(6),
                Wafers = r.IsDBNull(7) ? [] : JsonSerializer.Deserialize(r.GetString(7), StorageJsonContext.Default.IReadOnlyListString) ?? [],
                AcceptedAt = r.IsDBNull(8) ? null : UnixMicros.ToDateTimeOffset(r.GetInt64(8)),
                AcceptedBy = r.IsDBNull(9) ? null : r.GetString(9),
            });
        }
        return list;
    }

    private long EnsureWafer(SqliteConnection connection, SqliteTransaction transaction, string name)
    {
        using var command = connection.CreateCommand();
        command.Transaction = transaction;
        command.CommandText = """
            INSERT INTO wafers (name, created_us) VALUES ($name, $now)
            ON CONFLICT (name) DO UPDATE SET name = excluded.name RETURNING id
            """;
        command.Parameters.AddWithValue("$name", name);
        command.Parameters.AddWithValue("$now", UnixMicros.From(_timeProvider.GetUtcNow()));
        return Convert.ToInt64(command.ExecuteScalar(), CultureInfo.InvariantCulture);
    }

    private static void BindField(SqliteCommand command, FieldRecord field, long? waferId)
    {
        command.Parameters.AddWithValue("$wafer", (object?)waferId ?? DBNull.Value);
        command.Parameters.AddWithValue("$size", field.SizeBytes);
        command.Parameters.AddWithValue("$w", (object?)field.WidthPx ?? DBNull.Value);
        command.Parameters.AddWithValue("$h", (object?)field.HeightPx ?? DBNull.Value);
        command.Parameters.AddWithValue("$nm", (object?)field.NmPerPx ?? DBNull.Value);
        command.Parameters.AddWithValue("$px", (object?)field.PositionXMm ?? DBNull.Value);
        command.Parameters.AddWithValue("$py", (object?)field.PositionYMm ?? DBNull.Value);
        command.Parameters.AddWithValue("$status", field.Status.ToString());
        command.Parameters.AddWithValue("$problem", (object?)field.Problem ?? DBNull.Value);
        command.Parameters.AddWithValue("$meta", (object?)field.MetadataJson ?? DBNull.Value);
    }

    private static FieldRecord? SelectField(SqliteConnection connection, SqliteTransaction? transaction, string where, object key)
    {
        using var command = connection.CreateCommand();
        command.Transaction = transaction;
        command.CommandText = $"SELECT {FieldColumns} FROM fields f LEFT JOIN wafers w ON w.id = f.wafer_id WHERE {where}";
        command.Parameters.AddWithValue("$key", key);
        using var reader = command.ExecuteReader();
        return reader.Read() ? ReadField(reader) : null;
    }

    private static IReadOnlyList<FieldRecord> SelectFields(SqliteConnection connection, string whereAndOrder, object key, int maxCount)
    {
        using var command = connection.CreateCommand();
        command.CommandText = $"SELECT {FieldColumns} FROM fields f LEFT JOIN wafers w ON w.id = f.wafer_id WHERE {whereAndOrder} LIMIT $n";
        command.Parameters.AddWithValue("$key", key);
        command.Parameters.AddWithValue("$n", maxCount);
        using var reader = command.ExecuteReader();
        var list = new List<FieldRecord>();
        while (reader.Read())
        {
            list.Add(ReadField(reader));
        }
        return list;
    }

    private static FieldRecord ReadField(SqliteDataReader r) => new()
    {
        Id = r.GetInt64(0),
        Wafer = r.IsDBNull(1) ? null : r.GetString(1),
        FilePath = r.GetString(2),
        RelativePath = r.GetString(3),
        Sha256 = r.GetString(4),
        SizeBytes = r.GetInt64(5),
        WidthPx = r.IsDBNull(6) ? null : r.GetInt32(6),
        HeightPx = r.IsDBNull(7) ? null : r.GetInt32(7),
        NmPerPx = r.IsDBNull(8) ? null : r.GetDouble(8),
        PositionXMm = r.IsDBNull(9) ? null : r.GetDouble(9),
        PositionYMm = r.IsDBNull(10) ? null : r.GetDouble(10),
        ImportedAt = UnixMicros.ToDateTimeOffset(r.GetInt64(11)),
        Status = Enum.Parse<FieldStatus>(r.GetString(12)),
        Problem = r.IsDBNull(13) ? null : r.GetString(13),
        MetadataJson = r.IsDBNull(14) ? null : r.GetString(14),
    };

    private static WaferRecord ReadWafer(SqliteDataReader r) =>
        new(r.GetInt64(0), r.GetString(1), r.IsDBNull(2) ? null : r.GetInt64(2), r.IsDBNull(3) ? null : r.GetString(3), UnixMicros.ToDateTimeOffset(r.GetInt64(4)));
}
