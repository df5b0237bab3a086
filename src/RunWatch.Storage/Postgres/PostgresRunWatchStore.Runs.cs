using System.Globalization;
using System.Text.Json;
using Npgsql;

namespace RunWatch.Storage.Postgres;

/// <summary>Runs.</summary>
public sealed partial class PostgresRunWatchStore
{
    private const string RunColumns = """
        r.id, ch.name, r.name, r.source, r.status, r.end_reason, r.recipe, r.wafers_json, r.setpoint_c, r.planned_s,
        r.started_us, r.ended_us, r.last_sample_us, r.l_nom_nm, r.l_eff_nm, r.t_eff_c, r.coverage, r.excursions_json, r.summary_json
        """;

    /// <inheritdoc />
    public Task<RunRecord> SaveRunAsync(RunRecord run, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(run);
        return WriteAsync(async (connection, transaction) =>
        {
            long chamberId = await ResolveChamberAsync(connection, run.Chamber, cancellationToken).ConfigureAwait(false);
            await using var command = new NpgsqlCommand(run.Id == 0
                ? """
                  INSERT INTO runs (chamber_id, name, source, status, end_reason, recipe, wafers_json, setpoint_c, planned_s, started_us,
                      ended_us, last_sample_us, l_nom_nm, l_eff_nm, t_eff_c, coverage, excursions_json, summary_json)
                  VALUES (@chamber, @name, @source, @status, @end_reason, @recipe, @wafers, @setpoint, @planned, @started,
                      @ended, @last_sample, @l_nom, @l_eff, @t_eff, @coverage, @excursions, @summary)
                  ON CONFLICT (chamber_id, name, started_us) DO UPDATE SET status = runs.status
                  RETURNING id
                  """
                : """
                  UPDATE runs SET chamber_id = @chamber, name = @name, source = @source, status = @status, end_reason = @end_reason,
                      recipe = @recipe, wafers_json = @wafers, setpoint_c = @setpoint, planned_s = @planned, started_us = @started,
                      ended_us = @ended, last_sample_us = @last_sample, l_nom_nm = @l_nom, l_eff_nm = @l_eff, t_eff_c = @t_eff,
                      coverage = @coverage, excursions_json = @excursions, summary_json = @summary
                  WHERE id = @id
                  RETURNING id
                  """, connection, transaction);
            PgParameters.Long(command, "id", run.Id);
            PgParameters.Long(command, "chamber", chamberId);
            PgParameters.Text(command, "name", run.Name);
            PgParameters.Text(command, "source", run.Source.ToString());
            PgParameters.Text(command, "status", run.Status == RunStatus.Open ? "open" : "closed");
            PgParameters.Text(command, "end_reason", run.EndReason?.ToString());
            PgParameters.Text(command, "recipe", run.Recipe);
            PgParameters.Text(command, "wafers", JsonSerializer.Serialize(run.Wafers, StorageJsonContext.Default.IReadOnlyListString));
            PgParameters.Double(command, "setpoint", run.SetpointC);
            PgParameters.Double(command, "planned", run.PlannedSeconds);
            PgParameters.Micros(command, "started", run.StartedAt);
            PgParameters.Micros(command, "ended", run.EndedAt);
            PgParameters.Micros(command, "last_sample", run.LastSampleAt);
            PgParameters.Double(command, "l_nom", run.LNomNm);
            PgParameters.Double(command, "l_eff", run.LEffNm);
            PgParameters.Double(command, "t_eff", run.TEffC);
            PgParameters.Double(command, "coverage", run.Coverage);
            PgParameters.Text(command, "excursions", RunThermalJson.Write(run.Excursions));
            PgParameters.Text(command, "summary", RunThermalJson.Write(run.Summary));
            object? id = await command.ExecuteScalarAsync(cancellationToken).ConfigureAwait(false);
            if (id is null)
            {
                throw new KeyNotFoundException("No run with id " + run.Id.ToString(CultureInfo.InvariantCulture));
            }
            return run with { Id = (long)id };
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<RunRecord?> GetRunAsync(long id, CancellationToken cancellationToken) =>
        ReadAsync(async connection =>
        {
            await using var command = new NpgsqlCommand("SELECT " + RunColumns + " FROM runs r JOIN chambers ch ON ch.id = r.chamber_id WHERE r.id = @id", connection);
            PgParameters.Long(command, "id", id);
            var runs = await ReadRunsAsync(command, cancellationToken).ConfigureAwait(false);
            return runs.Count == 0 ? null : runs[0];
        }, cancellationToken);

    /// <inheritdoc />
    public Task<IReadOnlyList<RunRecord>> ListRunsAsync(string? chamber, DateTimeOffset? startedBefore, int maxCount, CancellationToken cancellationToken)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(maxCount);
        return ReadAsync<IReadOnlyList<RunRecord>>(async connection =>
        {
            await using var command = new NpgsqlCommand("SELECT " + RunColumns + """
                 FROM runs r JOIN chambers ch ON ch.id = r.chamber_id
                WHERE (@chamber::text IS NULL OR ch.name = @chamber) AND r.started_us < @before
                ORDER BY r.started_us DESC, r.id DESC LIMIT @limit
                """, connection);
            PgParameters.Text(command, "chamber", chamber);
            PgParameters.Long(command, "before", startedBefore is { } before ? UnixMicros.From(before) : long.MaxValue);
            PgParameters.Int(command, "limit", maxCount);
            return await ReadRunsAsync(command, cancellationToken).ConfigureAwait(false);
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<IReadOnlyList<RunRecord>> GetOpenRunsAsync(CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<RunRecord>>(async connection =>
        {
            await using var command = new NpgsqlCommand(
                "SELECT " + RunColumns + " FROM runs r JOIN chambers ch ON ch.id = r.chamber_id WHERE r.status = 'open' ORDER BY r.started_us", connection);
            return await ReadRunsAsync(command, cancellationToken).ConfigureAwait(false);
        }, cancellationToken);

    private static async Task<List<RunRecord>> ReadRunsAsync(NpgsqlCommand command, CancellationToken cancellationToken)
    {
        var result = new List<RunRecord>();
        await using var reader = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
        while (await reader.ReadAsync(cancellationToken).ConfigureAwait(false))
        {
            result.Add(ReadRun(reader));
        }
        return result;
    }

    private static RunRecord ReadRun(NpgsqlDataReader r) => new()
    {
        Id = r.GetInt64(0),
        Chamber = r.GetString(1),
        Name = r.GetString(2),
        Source = Enum.Parse<RunSource>(r.GetString(3)),
        Status = r.GetString(4) == "open" ? RunStatus.Open : RunStatus.Closed,
        EndReason = r.IsDBNull(5) ? null : Enum.Parse<RunEndReason>(r.GetString(5)),
        Recipe = r.IsDBNull(6) ? null : r.GetString(6),
        Wafers = JsonSerializer.Deserialize(r.GetString(7), StorageJsonContext.Default.IReadOnlyListString) ?? [],
        SetpointC = r.IsDBNull(8) ? null : r.GetDouble(8),
        PlannedSeconds = r.IsDBNull(9) ? null : r.GetDouble(9),
        StartedAt = UnixMicros.ToDateTimeOffset(r.GetInt64(10)),
        EndedAt = r.IsDBNull(11) ? null : UnixMicros.ToDateTimeOffset(r.GetInt64(11)),
        LastSampleAt = r.IsDBNull(12) ? null : UnixMicros.ToDateTimeOffset(r.GetInt64(12)),
        LNomNm = r.IsDBNull(13) ? null : r.GetDouble(13),
        LEffNm = r.IsDBNull(14) ? null : r.GetDouble(14),
        TEffC = r.IsDBNull(15) ? null : r.GetDouble(15),
        Coverage = r.IsDBNull(16) ? null : r.GetDouble(16),
        Excursions = r.IsDBNull(17) ? null : RunThermalJson.ReadExcursions(r.GetString(17)),
        Summary = r.IsDBNull(18) ? null : RunThermalJson.ReadSummary(r.GetString(18)),
    };
}
