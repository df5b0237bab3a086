using System.Globalization;
using System.Reflection;
using Npgsql;

namespace RunWatch.Storage.Postgres;

/// <summary>
/// Applies the numbered SQL scripts embedded under Postgres/Migrations (<c>NNNN_name.sql</c>) in order, in one
/// transaction with their rows in <c>schema_migrations</c> (PostgreSQL's DDL is transactional). A transaction-level
/// advisory lock makes daemons that start together wait for each other instead of applying a script twice.
/// </summary>
internal static class PostgresMigrator
{
    /// <summary>Advisory lock key of migrations (any fixed number; chamber ownership keys live in their own key space).</summary>
    public const long MigrationLockKey = 0x52_57_4D_49_47; // "RWMIG"

    private const string ResourcePrefix = "RunWatch.Storage.Postgres.Migrations.";

    public static IReadOnlyList<(int Version, string Name, string Sql)> LoadScripts()
    {
        var assembly = typeof(PostgresMigrator).Assembly;
        var scripts = new List<(int, string, string)>();
        foreach (string resource in assembly.GetManifestResourceNames())
        {
            if (!resource.StartsWith(ResourcePrefix, StringComparison.Ordinal) || !resource.EndsWith(".sql", StringComparison.Ordinal))
            {
                continue;
            }
            string name = resource[ResourcePrefix.Length..^4];
            int underscore = name.IndexOf('_', StringComparison.Ordinal);
            if (underscore <= 0 || !int.TryParse(name.AsSpan(0, underscore), NumberStyles.None, CultureInfo.InvariantCulture, out int version))
            {
                throw new InvalidOperationException("Migration resource name must be NNNN_name.sql: " + resource);
            }
            scripts.Add((version, name, ReadResource(assembly, resource)));
        }
        scripts.Sort((a, b) => a.Item1.CompareTo(b.Item1));
        for (int i = 1; i < scripts.Count; i++)
        {
            if (scripts[i].Item1 == scripts[i - 1].Item1)
            {
                throw new InvalidOperationException("Two migrations share version " + scripts[i].Item1.ToString(CultureInfo.InvariantCulture));
            }
        }
        return scripts;
    }

    public static async Task<int> ApplyAsync(NpgsqlConnection connection, TimeProvider timeProvider, CancellationToken cancellationToken)
    {
        await using var transaction = await connection.BeginTransactionAsync(cancellationToken).ConfigureAwait(false);
        await using (var command = new NpgsqlCommand("SELECT pg_advisory_xact_lock(@key)", connection, transaction))
        {
            command.Parameters.AddWithValue("key", MigrationLockKey);
            await command.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false);
        }
        await using (var create = new NpgsqlCommand(
            "CREATE TABLE IF NOT EXISTS schema_migrations (version integer PRIMARY KEY, name text NOT NULL, applied_us bigint NOT NULL)", connection, transaction))
        {
            await create.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false);
        }
        var applied = new HashSet<int>();
        await using (var query = new NpgsqlCommand("SELECT version FROM schema_migrations", connection, transaction))
        await using (var reader = await query.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false))
        {
            while (await reader.ReadAsync(cancellationToken).ConfigureAwait(false))
            {
                applied.Add(reader.GetInt32(0));
            }
        }
        int count = 0;
        foreach (var (version, name, sql) in LoadScripts())
        {
            if (applied.Contains(version))
            {
                continue;
            }
            await using (var script = new NpgsqlCommand(sql, connection, transaction))
            {
                await script.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false);
            }
            await using (var record = new NpgsqlCommand("INSERT INTO schema_migrations (version, name, applied_us) VALUES (@v, @n, @t)", connection, transaction))
            {
                record.Parameters.AddWithValue("v", version);
                record.Parameters.AddWithValue("n", name);
                record.Parameters.AddWithValue("t", UnixMicros.From(timeProvider.GetUtcNow()));
                await record.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false);
            }
            count++;
        }
        await transaction.CommitAsync(cancellationToken).ConfigureAwait(false);
        return count;
    }

    private static string ReadResource(Assembly assembly, string resource)
    {
        using var stream = assembly.GetManifestResourceStream(resource) ?? throw new InvalidOperationException("Missing resource " + resource);
        using var reader = new StreamReader(stream);
        return reader.ReadToEnd();
    }
}
