using System.Globalization;
using Microsoft.Data.Sqlite;

namespace RunWatch.Storage.Sqlite;

/// <summary>Report revisions and the requests they answer.</summary>
public sealed partial class SqliteRunWatchStore : IReportRevisionStore
{
    private const string RevisionColumns = """
        id, wafer, revision, created_us, reason, requester, software_version, config_sha256, config_json, model_id,
        inputs_json, content_sha256, folder, verdict, digest_json
        """;

    /// <inheritdoc />
    public Task<ReportRequestRecord> AddReportRequestAsync(ReportRequestRecord request, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(request);
        return WriteAsync(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = "INSERT INTO report_requests (wafer, requested_us, requester, reason) VALUES ($w, $t, $by, $why) RETURNING id";
            command.Parameters.AddWithValue("$w", request.Wafer);
            command.Parameters.AddWithValue("$t", UnixMicros.From(request.RequestedAt));
            command.Parameters.AddWithValue("$by", request.Requester);
            command.Parameters.AddWithValue("$why", request.Reason);
            return request with { Id = Convert.ToInt64(command.ExecuteScalar(), CultureInfo.InvariantCulture) };
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<IReadOnlyList<ReportRequestRecord>> GetPendingReportRequestsAsync(string wafer, CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<ReportRequestRecord>>(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = "SELECT id, wafer, requested_us, requester, reason FROM report_requests WHERE wafer = $w AND revision IS NULL ORDER BY id";
            command.Parameters.AddWithValue("$w", wafer);
            using var r = command.ExecuteReader();
            var list = new List<ReportRequestRecord>();
            while (r.Read())
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
        return WriteAsync(connection =>
        {
            using var transaction = connection.BeginTransaction();
            using var insert = connection.CreateCommand();
            insert.Transaction = transaction;
            insert.CommandText = """
                INSERT INTO report_revisions (wafer, revision, created_us, reason, requester, software_version, config_sha256, config_json,
                    model_id, inputs_json, content_sha256, folder, verdict, digest_json)
                VALUES ($w, $n, $t, $why, $by, $v, $ch, $cj, $m, $in, $h, $f, $verdict, $d)
                ON CONFLICT (wafer, revision) DO NOTHING RETURNING id
                """;
            insert.Parameters.AddWithValue("$w", revision.Wafer);
            insert.Parameters.AddWithValue("$n", revision.Revision);
            insert.Parameters.AddWithValue("$t", UnixMicros.From(revision.CreatedAt));
            insert.Parameters.AddWithValue("$why", revision.Reason);
            insert.Parameters.AddWithValue("$by", revision.Requester);
            insert.Parameters.AddWithValue("$v", revision.SoftwareVersion);
            insert.Parameters.AddWithValue("$ch", revision.ConfigSha256);
            insert.Parameters.AddWithValue("$cj", revision.ConfigJson);
            insert.Parameters.AddWithValue("$m", revision.ModelId);
            insert.Parameters.AddWithValue("$in", ReportRevisionJson.WriteInputs(revision.Inputs));
            insert.Parameters.AddWithValue("$h", revision.ContentSha256);
            insert.Parameters.AddWithValue("$f", revision.Folder);
            insert.Parameters.AddWithValue("$verdict", revision.Verdict);
            insert.Parameters.AddWithValue("$d", revision.DigestJson);
            object? id = insert.ExecuteScalar();
            if (id is null or DBNull)
            {
                return null;
            }
            foreach (long requestId in answeredRequestIds)
            {
                using var answer = connection.CreateCommand();
                answer.Transaction = transaction;
                answer.CommandText = "UPDATE report_requests SET revision = $n WHERE id = $id AND revision IS NULL";
                answer.Parameters.AddWithValue("$n", revision.Revision);
                answer.Parameters.AddWithValue("$id", requestId);
                answer.ExecuteNonQuery();
            }
            transaction.Commit();
            return revision with { Id = Convert.ToInt64(id, CultureInfo.InvariantCulture) };
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<IReadOnlyList<ReportRevisionRecord>> GetReportRevisionsAsync(string wafer, CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<ReportRevisionRecord>>(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = "SELECT " + RevisionColumns + " FROM report_revisions WHERE wafer = $w ORDER BY revision";
            command.Parameters.AddWithValue("$w", wafer);
            return ReadRevisions(command);
        }, cancellationToken);

    /// <inheritdoc />
    public Task<ReportRevisionRecord?> FindReportRevisionAsync(string contentSha256, CancellationToken cancellationToken) =>
        ReadAsync(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = "SELECT " + RevisionColumns + " FROM report_revisions WHERE content_sha256 = $h ORDER BY id LIMIT 1";
            command.Parameters.AddWithValue("$h", contentSha256);
            var list = ReadRevisions(command);
            return list.Count == 0 ? null : list[0];
        }, cancellationToken);

    private static List<ReportRevisionRecord> ReadRevisions(SqliteCommand command)
    {
        using var r = command.ExecuteReader();
        var list = new List<ReportRevisionRecord>();
        while (r.Read())
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
