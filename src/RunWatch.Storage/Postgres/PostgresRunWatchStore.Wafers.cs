using System.Globalization;
using System.Text.Json;
using Npgsql;

namespace RunWatch.Storage.Postgres;

/// <summary>The wafer pipeline's tables: wafers, fields, analyses, reports, model fits.</summary>
public sealed partial class PostgresRunWatchStore
{
    private const string FieldColumns = """
        f.id, w.name, f.file_path, f.relative_path, f.sha256, f.size_bytes, f.width_px, f.height_px, f.nm_per_px,
        f.position_x_mm, f.position_y_mm, f.imported_us, f.status, f.problem, f.metadata_json
        """;

    /// <inheritdoc />
    public Task<WaferRecord> UpsertWaferAsync(string name, long? runId, string? process, CancellationToken cancellationToken)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(name);
        return WriteAsync(async (connection, transaction) =>
        {
            await using var command = new NpgsqlCommand("""
                INSERT INTO wafers (name, run_id, process, created_us) VALUES (@name, @run, @process, @now)
                ON CONFLICT (name) DO UPDATE SET run_id = COALESCE(excluded.run_id, wafers.run_id),
                    process = COALESCE(excluded.process, wafers.process)
                RETURNING id, name, run_id, process, created_us
                """, connection, transaction);
            PgParameters.Text(command, "name", name);
            PgParameters.Long(command, "run", runId);
            PgParameters.Text(command, "process", process);
            PgParameters.Micros(command, "now", _timeProvider.GetUtcNow());
            return (await ReadWafersAsync(command, cancellationToken).ConfigureAwait(false))[0];
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<WaferRecord?> GetWaferAsync(string name, CancellationToken cancellationToken) =>
        ReadAsync(async connection =>
        {
            await using var command = new NpgsqlCommand("SELECT id, name, run_id, process, created_us FROM wafers WHERE name = @name", connection);
            PgParameters.Text(command, "name", name);
            var list = await ReadWafersAsync(command, cancellationToken).ConfigureAwait(false);
            return list.Count == 0 ? null : list[0];
        }, cancellationToken);

    /// <inheritdoc />
    public Task<IReadOnlyList<WaferRecord>> ListWafersAsync(int maxCount, CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<WaferRecord>>(async connection =>
        {
            await using var command = new NpgsqlCommand("SELECT id, name, run_id, process, created_us FROM wafers ORDER BY id DESC LIMIT @n", connection);
            PgParameters.Int(command, "n", maxCount);
            return await ReadWafersAsync(command, cancellationToken).ConfigureAwait(false);
        }, cancellationToken);

    /// <inheritdoc />
    public async Task<RunRecord?> FindRunOfWaferAsync(string wafer, CancellationToken cancellationToken)
    {
        long? runId = await ReadAsync(async connection =>
        {
            await using var command = new NpgsqlCommand(
                "SELECT r.id FROM runs r WHERE r.wafers_json::jsonb ? @wafer ORDER BY r.started_us DESC LIMIT 1", connection);
            PgParameters.Text(command, "wafer", wafer);
            return await command.ExecuteScalarAsync(cancellationToken).ConfigureAwait(false) is long id ? id : (long?)null;
        }, cancellationToken).ConfigureAwait(false);
        return runId is null ? null : await GetRunAsync(runId.Value, cancellationToken).ConfigureAwait(false);
    }

    /// <inheritdoc />
    public Task<(FieldRecord Field, bool Added)> AddFieldAsync(FieldRecord field, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(field);
        return WriteAsync(async (connection, transaction) =>
        {
            long? waferId = field.Wafer is null ? null : await EnsureWaferAsync(connection, transaction, field.Wafer, cancellationToken).ConfigureAwait(false);
            await using var insert = new NpgsqlCommand("""
                INSERT INTO fields (wafer_id, file_path, relative_path, sha256, size_bytes, width_px, height_px, nm_per_px,
                    position_x_mm, position_y_mm, imported_us, status, problem, metadata_json)
                VALUES (@wafer, @path, @rel, @sha, @size, @w, @h, @nm, @px, @py, @imported, @status, @problem, @meta)
                ON CONFLICT (sha256) DO NOTHING
                RETURNING id
                """, connection, transaction);
            BindField(insert, field, waferId);
            PgParameters.Text(insert, "path", field.FilePath);
            PgParameters.Text(insert, "rel", field.RelativePath);
            PgParameters.Text(insert, "sha", field.Sha256);
            PgParameters.Micros(insert, "imported", field.ImportedAt);
            object? id = await insert.ExecuteScalarAsync(cancellationToken).ConfigureAwait(false);
            bool added = id is long;
            FieldRecord stored = (await SelectFieldsAsync(connection, transaction, added ? "f.id = @key" : "f.sha256 = @key",
                added ? (long)id! : field.Sha256, 1, cancellationToken).ConfigureAwait(false))[0];
            return (stored, added);
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<FieldRecord> UpdateFieldAsync(FieldRecord field, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(field);
        return WriteAsync(async (connection, transaction) =>
        {
            long? waferId = field.Wafer is null ? null : await EnsureWaferAsync(connection, transaction, field.Wafer, cancellationToken).ConfigureAwait(false);
            await using var update = new NpgsqlCommand("""
                UPDATE fields SET wafer_id = @wafer, size_bytes = @size, width_px = @w, height_px = @h, nm_per_px = @nm,
                    position_x_mm = @px, position_y_mm = @py, status = @status, problem = @problem, metadata_json = @meta
                WHERE id = @id
                """, connection, transaction);
            BindField(update, field, waferId);
            PgParameters.Long(update, "id", field.Id);
            if (await update.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false) != 1)
            {
                throw new KeyNotFoundException("no field with id " + field.Id.ToString(CultureInfo.InvariantCulture));
            }
            return (await SelectFieldsAsync(connection, transaction, "f.id = @key", field.Id, 1, cancellationToken).ConfigureAwait(false))[0];
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<FieldRecord?> GetFieldAsync(long id, CancellationToken cancellationToken) =>
        ReadAsync(async connection =>
        {
            var list = await SelectFieldsAsync(connection, null, "f.id = @key", id, 1, cancellationToken).ConfigureAwait(false);
            return list.Count == 0 ? null : list[0];
        }, cancellationToken);

    /// <inheritdoc />
    public Task<IReadOnlyList<FieldRecord>> GetFieldsOfWaferAsync(string wafer, CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<FieldRecord>>(async connection =>
            await SelectFieldsAsync(connection, null, "w.name = @key ORDER BY f.id", wafer, int.MaxValue, cancellationToken).ConfigureAwait(false), cancellationToken);

    /// <inheritdoc />
    public Task<IReadOnlyList<FieldRecord>> GetFieldsByStatusAsync(FieldStatus status, int maxCount, CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<FieldRecord>>(async connection =>
            await SelectFieldsAsync(connection, null, "f.status = @key ORDER BY f.id", status.ToString(), maxCount, cancellationToken).ConfigureAwait(false), cancellationToken);

    /// <inheritdoc />
    /// <remarks>
    /// <c>FOR UPDATE SKIP LOCKED</c>: a daemon claiming at the same moment as another skips the row the other has
    /// locked and takes the next one instead of waiting for it, and never takes the same one.
    /// </remarks>
    public Task<FieldRecord?> ClaimQueuedFieldAsync(string worker, DateTimeOffset now, TimeSpan lease, CancellationToken cancellationToken)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(worker);
        return WriteAsync(async (connection, transaction) =>
        {
            await using var claim = new NpgsqlCommand("""
                UPDATE fields SET claimed_by = @worker, claimed_until_us = @until
                WHERE id = (SELECT id FROM fields WHERE status = 'Queued' AND (claimed_until_us IS NULL OR claimed_until_us <= @now)
                            ORDER BY id LIMIT 1 FOR UPDATE SKIP LOCKED)
                RETURNING id
                """, connection, transaction);
            PgParameters.Text(claim, "worker", worker);
            PgParameters.Micros(claim, "now", now);
            PgParameters.Micros(claim, "until", now + lease);
            if (await claim.ExecuteScalarAsync(cancellationToken).ConfigureAwait(false) is not long id)
            {
                return null;
            }
            return (await SelectFieldsAsync(connection, transaction, "f.id = @key", id, 1, cancellationToken).ConfigureAwait(false))[0];
        }, cancellationToken);
    }

    /// <inheritdoc />
    /// <remarks>The row is locked with <c>SKIP LOCKED</c>: a worker claiming it at the same moment gets false, it does not wait.</remarks>
    public Task<bool> ClaimFieldAsync(long fieldId, string worker, DateTimeOffset now, TimeSpan lease, CancellationToken cancellationToken)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(worker);
        return WriteAsync(async (connection, transaction) =>
        {
            await using var command = new NpgsqlCommand("""
                UPDATE fields SET claimed_by = @worker, claimed_until_us = @until
                WHERE id = (SELECT id FROM fields WHERE id = @id AND status = 'Queued'
                            AND (claimed_until_us IS NULL OR claimed_until_us <= @now OR claimed_by = @worker) FOR UPDATE SKIP LOCKED)
                """, connection, transaction);
            PgParameters.Long(command, "id", fieldId);
            PgParameters.Text(command, "worker", worker);
            PgParameters.Micros(command, "now", now);
            PgParameters.Micros(command, "until", now + lease);
            return await command.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false) == 1;
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task ReleaseFieldClaimAsync(long fieldId, string worker, CancellationToken cancellationToken) =>
        WriteAsync(async (connection, transaction) =>
        {
            await using var command = new NpgsqlCommand(
                "UPDATE fields SET claimed_by = NULL, claimed_until_us = NULL WHERE id = @id AND claimed_by = @worker", connection, transaction);
            PgParameters.Long(command, "id", fieldId);
            PgParameters.Text(command, "worker", worker);
            return await command.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false);
        }, cancellationToken);

    /// <inheritdoc />
    public Task<AnalysisRecord> SaveAnalysisAsync(AnalysisRecord analysis, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(analysis);
        return WriteAsync(async (connection, transaction) =>
        {
            await using var command = new NpgsqlCommand("""
                INSERT INTO analyses (field_id, started_us, finished_us, status, wire_count, results_json, diffusion_length_nm, settings_json, problem)
                VALUES (@field, @started, @finished, @status, @wires, @results, @l, @settings, @problem)
                RETURNING id
                """, connection, transaction);
            PgParameters.Long(command, "field", analysis.FieldId);
            PgParameters.Micros(command, "started", analysis.StartedAt);
            PgParameters.Micros(command, "finished", analysis.FinishedAt);
            PgParameters.Text(command, "status", analysis.Status);
            PgParameters.Int(command, "wires", analysis.WireCount);
            PgParameters.Text(command, "results", analysis.ResultsJson);
            PgParameters.Double(command, "l", analysis.DiffusionLengthNm);
            PgParameters.Text(command, "settings", analysis.SettingsJson);
            PgParameters.Text(command, "problem", analysis.Problem);
            long id = (long)(await command.ExecuteScalarAsync(cancellationToken).ConfigureAwait(false))!;
            return analysis with { Id = id };
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<AnalysisRecord?> GetLatestAnalysisAsync(long fieldId, CancellationToken cancellationToken) =>
        ReadAsync(async connection =>
        {
            await using var command = new NpgsqlCommand("""
                SELECT id, field_id, started_us, finished_us, status, wire_count, results_json, diffusion_length_nm, settings_json, problem
                FROM analyses WHERE field_id = @field ORDER BY id DESC LIMIT 1
                """, connection);
            PgParameters.Long(command, "field", fieldId);
            await using var r = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
            if (!await r.ReadAsync(cancellationToken).ConfigureAwait(false))
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
        return WriteAsync(async (connection, transaction) =>
        {
            long waferId = await EnsureWaferAsync(connection, transaction, report.Wafer, cancellationToken).ConfigureAwait(false);
            await using var command = new NpgsqlCommand("""
                INSERT INTO reports (wafer_id, created_us, verdict, format, file_path, summary_json)
                VALUES (@wafer, @created, @verdict, @format, @path, @summary) RETURNING id
                """, connection, transaction);
            PgParameters.Long(command, "wafer", waferId);
            PgParameters.Micros(command, "created", report.CreatedAt);
            PgParameters.Text(command, "verdict", report.Verdict);
            PgParameters.Text(command, "format", report.Format);
            PgParameters.Text(command, "path", report.FilePath);
            PgParameters.Text(command, "summary", report.SummaryJson);
            long id = (long)(await command.ExecuteScalarAsync(cancellationToken).ConfigureAwait(false))!;
            return report with { Id = id };
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<IReadOnlyList<WaferReportRecord>> GetReportsAsync(string wafer, CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<WaferReportRecord>>(async connection =>
        {
            await using var command = new NpgsqlCommand("""
                SELECT r.id, w.name, r.created_us, r.verdict, r.format, r.file_path, r.summary_json
                FROM reports r JOIN wafers w ON w.id = r.wafer_id
                WHERE w.name = @wafer AND r.id IN (SELECT MAX(r2.id) FROM reports r2 WHERE r2.wafer_id = w.id GROUP BY r2.format)
                ORDER BY r.id DESC
                """, connection);
            PgParameters.Text(command, "wafer", wafer);
            await using var r = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
            var list = new List<WaferReportRecord>();
            while (await r.ReadAsync(cancellationToken).ConfigureAwait(false))
            {
                list.Add(new WaferReportRecord(r.GetInt64(0), r.GetString(1), UnixMicros.ToDateTimeOffset(r.GetInt64(2)),
                    r.IsDBNull(3) ? "" : r.GetString(3), r.GetString(4), r.GetString(5), r.IsDBNull(6) ? null : r.GetString(6)));
            }
            return list;
        }, cancellationToken);

    /// <inheritdoc />
    public Task<IReadOnlyList<RunWaferVerdict>> GetLatestRunVerdictsAsync(CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<RunWaferVerdict>>(async connection =>
        {
            await using var command = new NpgsqlCommand("""
                SELECT w.run_id, w.name, r.verdict
                FROM reports r JOIN wafers w ON w.id = r.wafer_id
                WHERE w.run_id IS NOT NULL AND r.verdict IS NOT NULL AND r.verdict <> ''
                  AND r.id = (SELECT MAX(r2.id) FROM reports r2 WHERE r2.wafer_id = w.id)
                """, connection);
            await using var r = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
            var list = new List<RunWaferVerdict>();
            while (await r.ReadAsync(cancellationToken).ConfigureAwait(false))
            {
                list.Add(new RunWaferVerdict(r.GetInt64(0), r.GetString(1), r.GetString(2)));
            }
            return list;
        }, cancellationToken);

    /// <inheritdoc />
    public Task<ModelFitRecord> SaveModelFitAsync(ModelFitRecord fit, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(fit);
        return WriteAsync(async (connection, transaction) =>
        {
            await using var command = new NpgsqlCommand("""
                INSERT INTO model_fits (process, model, fitted_us, params_json, r_squared, rmse_nm, wafer_count, wafers_json, accepted_us, accepted_by)
                VALUES (@process, @model, @fitted, @params, @r2, @rmse, @count, @wafers, @accepted, @by) RETURNING id
                """, connection, transaction);
            PgParameters.Text(command, "process", fit.Process);
            PgParameters.Text(command, "model", fit.Model);
            PgParameters.Micros(command, "fitted", fit.FittedAt);
            PgParameters.Text(command, "params", fit.ParamsJson);
            PgParameters.Double(command, "r2", fit.RSquared);
            PgParameters.Double(command, "rmse", fit.RmseNm);
            PgParameters.Int(command, "count", fit.Wafers.Count);
            PgParameters.Text(command, "wafers", JsonSerializer.Serialize(fit.Wafers, StorageJsonContext.Default.IReadOnlyListString));
            PgParameters.Micros(command, "accepted", fit.AcceptedAt);
            PgParameters.Text(command, "by", fit.AcceptedBy);
            long id = (long)(await command.ExecuteScalarAsync(cancellationToken).ConfigureAwait(false))!;
            return fit with { Id = id };
        }, cancellationToken);
    }

    /// <inheritdoc />
    public async Task<ModelFitRecord?> AcceptModelFitAsync(long id, string actor, CancellationToken cancellationToken)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(actor);
        int changed = await WriteAsync(async (connection, transaction) =>
        {
            await using var command = new NpgsqlCommand("UPDATE model_fits SET accepted_us = @now, accepted_by = @actor WHERE id = @id", connection, transaction);
            PgParameters.Micros(command, "now", _timeProvider.GetUtcNow());
            PgParameters.Text(command, "actor", actor);
            PgParameters.Long(command, "id", id);
            return await command.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false);
        }, cancellationToken).ConfigureAwait(false);
        if (changed == 0)
        {
            return null;
        }
        var fits = await ReadAsync(connection => SelectFitsAsync(connection, "id = @key", id, 1, null, cancellationToken), cancellationToken).ConfigureAwait(false);
        return fits.Count == 0 ? null : fits[0];
    }

    /// <inheritdoc />
    public Task<IReadOnlyList<ModelFitRecord>> GetModelFitsAsync(string process, string model, int maxCount, CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<ModelFitRecord>>(async connection =>
            await SelectFitsAsync(connection, "process = @key AND model = @model", process, maxCount, model, cancellationToken).ConfigureAwait(false), cancellationToken);

    private static async Task<List<ModelFitRecord>> SelectFitsAsync(NpgsqlConnection connection, string where, object key, int maxCount, string? model, CancellationToken cancellationToken)
    {
        await using var command = new NpgsqlCommand($"""
            SELECT id, process, model, fitted_us, params_json, r_squared, rmse_nm, wafers_json, accepted_us, accepted_by
            FROM model_fits WHERE {where} ORDER BY id DESC LIMIT @n
            """, connection);
        AddKey(command, key);
        PgParameters.Int(command, "n", maxCount);
        if (model is not null)
        {
            PgParameters.Text(command, "model", model);
        }
        await using var r = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
        var list = new List<ModelFitRecord>();
        while (await r.ReadAsync(cancellationToken).ConfigureAwait(false))
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

    private async Task<long> EnsureWaferAsync(NpgsqlConnection connection, NpgsqlTransaction transaction, string name, CancellationToken cancellationToken)
    {
        await using var command = new NpgsqlCommand("""
            INSERT INTO wafers (name, created_us) VALUES (@name, @now)
            ON CONFLICT (name) DO UPDATE SET name = excluded.name RETURNING id
            """, connection, transaction);
        PgParameters.Text(command, "name", name);
        PgParameters.Micros(command, "now", _timeProvider.GetUtcNow());
        return (long)(await command.ExecuteScalarAsync(cancellationToken).ConfigureAwait(false))!;
    }

    private static void BindField(NpgsqlCommand command, FieldRecord field, long? waferId)
    {
        PgParameters.Long(command, "wafer", waferId);
        PgParameters.Long(command, "size", field.SizeBytes);
        PgParameters.Int(command, "w", field.WidthPx);
        PgParameters.Int(command, "h", field.HeightPx);
        PgParameters.Double(command, "nm", field.NmPerPx);
        PgParameters.Double(command, "px", field.PositionXMm);
        PgParameters.Double(command, "py", field.PositionYMm);
        PgParameters.Text(command, "status", field.Status.ToString());
        PgParameters.Text(command, "problem", field.Problem);
        PgParameters.Text(command, "meta", field.MetadataJson);
    }

    private static void AddKey(NpgsqlCommand command, object key)
    {
        if (key is long id)
        {
            PgParameters.Long(command, "key", id);
        }
        else
        {
            PgParameters.Text(command, "key", (string)key);
        }
    }

    private static async Task<List<FieldRecord>> SelectFieldsAsync(NpgsqlConnection connection, NpgsqlTransaction? transaction, string whereAndOrder, object key, int maxCount,
        CancellationToken cancellationToken)
    {
        await using var command = new NpgsqlCommand($"SELECT {FieldColumns} FROM fields f LEFT JOIN wafers w ON w.id = f.wafer_id WHERE {whereAndOrder} LIMIT @n", connection, transaction);
        AddKey(command, key);
        PgParameters.Int(command, "n", maxCount);
        await using var r = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
        var list = new List<FieldRecord>();
        while (await r.ReadAsync(cancellationToken).ConfigureAwait(false))
        {
            list.Add(ReadField(r));
        }
        return list;
    }

    private static FieldRecord ReadField(NpgsqlDataReader r) => new()
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

    private static async Task<List<WaferRecord>> ReadWafersAsync(NpgsqlCommand command, CancellationToken cancellationToken)
    {
        await using var r = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
        var list = new List<WaferRecord>();
        while (await r.ReadAsync(cancellationToken).ConfigureAwait(false))
        {
            list.Add(new WaferRecord(r.GetInt64(0), r.GetString(1), r.IsDBNull(2) ? null : r.GetInt64(2), r.IsDBNull(3) ? null : r.GetString(3),
                UnixMicros.ToDateTimeOffset(r.GetInt64(4))));
        }
        return list;
    }
}
