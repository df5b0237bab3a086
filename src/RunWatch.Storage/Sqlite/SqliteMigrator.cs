using System.Globalization;
using System.Reflection;
using Microsoft.Data.Sqlite;

namespace RunWatch.Storage.Sqlite;

/// <summary>
/// Applies the numbered SQL scripts embedded under Sqlite/Migrations (<c>NNNN_name.sql</c>) in order, each in its own
/// transaction together with its row in <c>schema_migrations</c>, so a failed script leaves the schema at the previous version.
/// </summary>
internal static class SqliteMigrator
{
    private const string ResourcePrefix = "RunWatch.Storage.Sqlite.Migrations.";

    public static IReadOnlyList<(int Version, string Name, string Sql)> LoadScripts()
    {
        var assembly = typeof(SqliteMigrator).Assembly;
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

    public static int Apply(SqliteConnection connection, TimeProvider timeProvider)
    {
        using (var create = connection.CreateCommand())
        {
            create.CommandText = "CREATE TABLE IF NOT EXISTS schema_migrations (version INTEGER PRIMARY KEY, name TEXT NOT NULL, applied_us INTEGER NOT NULL)";
            create.ExecuteNonQuery();
        }
        var applied = new HashSet<int>();
        using (var query = connection.CreateCommand())
        {
            query.CommandText = "SELECT version FROM schema_migrations";
            using var reader = query.ExecuteReader();
            while (reader.Read())
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
            using var transaction = connection.BeginTransaction();
            using (var script = connection.CreateCommand())
            {
                script.Transaction = transaction;
                script.CommandText = sql;
                script.ExecuteNonQuery();
            }
            using (var record = connection.CreateCommand())
            {
                record.Transaction = transaction;
                record.CommandText = "INSERT INTO schema_migrations (version, name, applied_us) VALUES ($v, $n, $t)";
                record.Parameters.AddWithValue("$v", version);
                record.Parameters.AddWithValue("$n", name);
                record.Parameters.AddWithValue("$t", UnixMicros.From(timeProvider.GetUtcNow()));
                record.ExecuteNonQuery();
            }
            transaction.Commit();
            count++;
        }
        return count;
    }

    private static string ReadResource(Assembly assembly, string resource)
    {
        using var stream = assembly.GetManifestResourceStream(resource) ?? throw new InvalidOperationException("Missing resource " + resource);
        using var reader = new StreamReader(stream);
        return reader.ReadToEnd();
    }
}
