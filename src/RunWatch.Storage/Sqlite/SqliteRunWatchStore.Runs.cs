using System.Globalization;
using System.Text.Json;
using Microsoft.Data.Sqlite;

namespace RunWatch.Storage.Sqlite;

/// <summary>Runs.</summary>
public sealed partial class SqliteRunWatchStore
{
    private const string RunColumns = """
        r.id, ch.name, r.name, r.source, r.status, r.end_reason, r.recipe, r.wafers_json, r.setpoint_c, r.planned_s,
        r.started_us, r.ended_us, r.last_sample_us, r.l_nom_nm, r.l_eff_nm, r.t_eff_c, r.coverage, r.excursions_json, r.summary_json
        """;

    /// <inheritdoc />
    public Task<RunRecord> SaveRunAsync(RunRecord run, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(run);
        return WriteAsync(connection =>
        {
            long chamberId = ResolveChamber(connection, run.Chamber);
            using var command = connection.CreateCommand();
            command.CommandText = run.Id == 0
                ? """
                  INSERT INTO runs (chamber_id, name, source, status, end_reason, recipe, wafers_json, setpoint_c, planned_s, started_us,
                      ended_us, last_sample_us, l_nom_nm, l_eff_nm, t_eff_c, coverage, excursions_json, summary_json)
                  VALUES ($chamber, $name, $source, $status, $end_reason, $recipe, $wafers, $setpoint, $planned, $started,
                      $ended, $last_sample, $l_nom, $l_eff, $t_eff, $coverage, $excursions, $summary)
                  ON CONFLICT (chamber_id, name, started_us) DO UPDATE SET status = status
                  RETURNING id
                  """
                : """
                  UPDATE runs SET chamber_id = $chamber, name = $name, source = $source, status = $status, end_reason = $end_reason,
                      recipe = $recipe, wafers_json = $wafers, setpoint_c = $setpoint, planned_s = $planned, started_us = $started,
                      ended_us = $ended, last_sample_us = $last_sample, l_nom_nm = $l_nom, l_eff_nm = $l_eff, t_eff_c = $t_eff,
                      coverage = $coverage, excursions_json = $excursions, summary_json = $summary
                  WHERE id = $id
                  RETURNING id
                  """;
            var p = command.Parameters;
            p.AddWithValue("$id", run.Id);
            p.AddWithValue("$chamber", chamberId);
            p.AddWithValue("$name", run.Name);
            p.AddWithValue("$source", run.Source.ToString());
            p.AddWithValue("$status", run.Status == RunStatus.Open ? "open" : "closed");
            p.AddWithValue("$end_reason", run.EndReason is { } reason ? reason.ToString() : DBNull.Value);
            p.AddWithValue("$recipe", (object?)run.Recipe ?? DBNull.Value);
            p.AddWithValue("$wafers", JsonSerializer.Serialize(run.Wafers, StorageJsonContext.Default.IReadOnlyListString));
            p.AddWithValue("$setpoint", (object?)run.SetpointC ?? DBNull.Value);
            p.AddWithValue("$planned", (object?)run.PlannedSeconds ?? DBNull.Value);
            p.AddWithValue("$started", UnixMicros.From(run.StartedAt));
            p.AddWithValue("$ended", run.EndedAt is { } ended ? UnixMicros.From(ended) : DBNull.Value);
            p.AddWithValue("$last_sample", run.LastSampleAt is { } last ? UnixMicros.From(last) : DBNull.Value);
            p.AddWithValue("$l_nom", (object?)run.LNomNm ?? DBNull.Value);
            p.AddWithValue("$l_eff", (object?)run.LEffNm ?? DBNull.Value);
            p.AddWithValue("$t_eff", (object?)run.TEffC ?? DBNull.Value);
            p.AddWithValue("$coverage", (object?)run.Coverage ?? DBNull.Value);
            p.AddWithValue("$excursions", (object?)RunThermalJson.Write(run.Excursions) ?? DBNull.Value);
            p.AddWithValue("$summary", (object?)RunThermalJson.Write(run.Summary) ?? DBNull.Value);
            object? id = command.ExecuteScalar();
            if (id is null)
            {
                throw new KeyNotFoundException("No run with id " + run.Id.ToString(CultureInfo.InvariantCulture));
            }
            return run with { Id = Convert.ToInt64(id, CultureInfo.InvariantCulture) };
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<RunRecord?> GetRunAsync(long id, CancellationToken cancellationToken) =>
        ReadAsync(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = "SELECT " + RunColumns + " FROM runs r JOIN chambers ch ON ch.id = r.chamber_id WHERE r.id = $id";
            command.Parameters.AddWithValue("$id", id);
            using var reader = command.ExecuteReader();
            return reader.Read() ? ReadRun(reader) : null;
        }, cancellationToken);

    /// <inheritdoc />
    public Task<IReadOnlyList<RunRecord>> ListRunsAsync(string? chamber, DateTimeOffset? startedBefore, int maxCount, CancellationToken cancellationToken)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(maxCount);
        return ReadAsync<IReadOnlyList<RunRecord>>(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = "SELECT " + RunColumns + """
                 FROM runs r JOIN chambers ch ON ch.id = r.chamber_id
                WHERE ($chamber IS NULL OR ch.name = $chamber) AND r.started_us < $before
                ORDER BY r.started_us DESC, r.id DESC LIMIT $limit
                """;
            command.Parameters.AddWithValue("$chamber", (object?)chamber ?? DBNull.Value);
            command.Parameters.AddWithValue("$before", startedBefore is { } before ? UnixMicros.From(before) : long.MaxValue);
            command.Parameters.AddWithValue("$limit", maxCount);
            return ReadRuns(command);
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<IReadOnlyList<RunRecord>> GetOpenRunsAsync(CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<RunRecord>>(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = "SELECT " + RunColumns + " FROM runs r JOIN chambers ch ON ch.id = r.chamber_id WHERE r.status = 'open' ORDER BY r.started_us";
            return ReadRuns(command);
        }, cancellationToken);

    private static List<RunRecord> ReadRuns(SqliteCommand command)
    {
        var result = new List<RunRecord>();
        using var reader = command.ExecuteReader();
        while (reader.Read())
        {
            result.Add(ReadRun(reader));
        }
        return result;
    }

    private static RunRecord ReadRun(SqliteDataReader r) => new()
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
