using Npgsql;

namespace RunWatch.Storage.Postgres;

/// <summary>Report revisions and the requests they answer.</summary>
public sealed partial class PostgresRunWatchStore : IReportRevisionStore
{
    private const string RevisionColumns = """
        id, wafer, revision, created_us, reason, requester, software_version, config_sha256, config_json, model_id,
        inputs_json, content_sha256, folder, verdict, digest_json
        """;

    /// <inheritdoc />
    public Task<ReportRequestRecord> AddReportRequestAsync(ReportRequestRecord request, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(request);
        return WriteAsync(async (connection, transaction) =>
        {
            await using var command = new NpgsqlCommand(
                "INSERT INTO report_requests (wafer, requested_us, requester, reason) VALUES (@w, @t, @by, @why) RETURNING id", connection, transaction);
            PgParameters.Text(command, "w", request.Wafer);
            PgParameters.Micros(command, "t", request.RequestedAt);
            PgParameters.Text(command, "by", request.Requester);
            PgParameters.Text(command, "why", request.Reason);
            return request with { Id = (long)(await command.ExecuteScalarAsync(cancellationToken).ConfigureAwait(false))! };
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<IReadOnlyList<ReportRequestRecord>> GetPendingReportRequestsAsync(string wafer, CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<ReportRequestRecord>>(async connection =>
        {
            await using var command = new NpgsqlCommand(
                "SELECT id, wafer, requested_us, requester, reason FROM report_requests WHERE wafer = @w AND revision IS NULL ORDER BY id", connection);
            PgParameters.Text(command, "w", wafer);
            await using var r = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
            var list = new List<ReportRequestRecord>();
            while (await r.ReadAsync(cancellationToken).ConfigureAwait(false))
            {
                list.Add(new ReportRequestRecord(r.GetInt64(0), r.GetString(1), UnixMicros.ToDateTimeOffset(r.GetInt64(2)), r.GetString(3), r.GetString(4)));
            }
            return list;
        }, cancellationToken);

    /// <inheritdoc />
    public Task<ReportRevisionRecord?> AddReportRevisionAsync(ReportRevisionRecord revision, IReadOnlyList<long> answeredRequestIds, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(revision);
        ArgumentNullException.ThrowIfNull(answeredRequestIds);
        return WriteAsync<ReportRevisionRecord?>(async (connection, transaction) =>
        {
            await using var insert = new NpgsqlCommand("""
                INSERT INTO report_revisions (wafer, revision, created_us, reason, requester, software_version, config_sha256, config_json,
                    model_id, inputs_json, content_sha256, folder, verdict, digest_json)
                VALUES (@w, @n, @t, @why, @by, @v, @ch, @cj, @m, @in, @h, @f, @verdict, @d)
                ON CONFLICT (wafer, revision) DO NOTHING RETURNING id
                """, connection, transaction);
            PgParameters.Text(insert, "w", revision.Wafer);
            PgParameters.Int(insert, "n", revision.Revision);
            PgParameters.Micros(insert, "t", revision.CreatedAt);
            PgParameters.Text(insert, "why", revision.Reason);
            PgParameters.Text(insert, "by", revision.Requester);
            PgParameters.Text(insert, "v", revision.SoftwareVersion);
            PgParameters.Text(insert, "ch", revision.ConfigSha256);
            PgParameters.Text(insert, "cj", revision.ConfigJson);
            PgParameters.Text(insert, "m", revision.ModelId);
            PgParameters.Text(insert, "in", ReportRevisionJson.WriteInputs(revision.Inputs));
            PgParameters.Text(insert, "h", revision.ContentSha256);
            PgParameters.Text(insert, "f", revision.Folder);
            PgParameters.Text(insert, "verdict", revision.Verdict);
            PgParameters.Text(insert, "d", revision.DigestJson);
            object? id = await insert.ExecuteScalarAsync(cancellationToken).ConfigureAwait(false);
            if (id is null or DBNull)
            {
                return null;
            }
            foreach (long requestId in answeredRequestIds)
            {
                await using var answer = new NpgsqlCommand("UPDATE report_requests SET revision = @n WHERE id = @id AND revision IS NULL", connection, transaction);
                PgParameters.Int(answer, "n", revision.Revision);
                PgParameters.Long(answer, "id", requestId);
                await answer.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false);
            }
            return revision with { Id = (long)id };
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<IReadOnlyList<ReportRevisionRecord>> GetReportRevisionsAsync(string wafer, CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<ReportRevisionRecord>>(async connection =>
        {
            await using var command = new NpgsqlCommand("SELECT " + RevisionColumns + " FROM report_revisions WHERE wafer = @w ORDER BY revision", connection);
            PgParameters.Text(command, "w", wafer);
            return await ReadRevisionsAsync(command, cancellationToken).ConfigureAwait(false);
        }, cancellationToken);

    /// <inheritdoc />
    public Task<ReportRevisionRecord?> FindReportRevisionAsync(string contentSha256, CancellationToken cancellationToken) =>
        ReadAsync<ReportRevisionRecord?>(async connection =>
        {
            await using var command = new NpgsqlCommand("SELECT " + RevisionColumns + " FROM report_revisions WHERE content_sha256 = @h ORDER BY id LIMIT 1", connection);
            PgParameters.Text(command, "h", contentSha256);
            var list = await ReadRevisionsAsync(command, cancellationToken).ConfigureAwait(false);
            return list.Count == 0 ? null : list[0];
        }, cancellationToken);

    private static async Task<List<ReportRevisionRecord>> ReadRevisionsAsync(NpgsqlCommand command, CancellationToken cancellationToken)
    {
        await using var r = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
        var list = new List<ReportRevisionRecord>();
        while (await r.ReadAsync(cancellationToken).ConfigureAwait(false))
        {
            list.Add(new ReportRevisionRecord
            {
                Id = r.GetInt64(0),
                Wafer = r.GetString(1),
                Revision = r.GetInt32(2),
                CreatedAt = UnixMicros.ToDateTimeOffset(r.GetInt64(3)),
                Reason = r.GetString(4),
                Requester = r.GetString(5),
                SoftwareVersion = r.GetString(6),
                ConfigSha256 = r.GetString(7),
                ConfigJson = r.GetString(8),
                ModelId = r.GetString(9),
                Inputs = ReportRevisionJson.ReadInputs(r.GetString(10)),
                ContentSha256 = r.GetString(11),
                Folder = r.GetString(12),
                Verdict = r.GetString(13),
                DigestJson = r.GetString(14),
            });
        }
        return list;
    }
}
