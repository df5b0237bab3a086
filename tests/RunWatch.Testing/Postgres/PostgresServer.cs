using System.Diagnostics;
using System.Globalization;
using System.Threading;
using Npgsql;

namespace RunWatch.Testing.Postgres;

/// <summary>
/// A real PostgreSQL server for tests. <see cref="SharedAsync"/> uses the cluster tests/run.sh started (its connection
/// string is in <c>RUNWATCH_TEST_POSTGRES</c>) or, when that is absent (a plain <c>dotnet test</c>), starts one cluster
/// for this test process with tests/postgres-cluster.sh (initdb + pg_ctl on a free loopback port in a temporary
/// folder) and stops it when the process exits. <see cref="StartOwnAsync"/> starts a private cluster a test may
/// restart. Nothing is skipped: if no server can be had, the test fails with the script's message.
/// </summary>
public sealed class PostgresServer : IAsyncDisposable
{
    /// <summary>Environment variable holding the connection string of a server the test run provides.</summary>
    public const string EnvironmentVariable = "RUNWATCH_TEST_POSTGRES";

    private static readonly SemaphoreSlim SharedGate = new(1, 1);
    private static PostgresServer? _shared;
    private static int _databaseCounter;
    private readonly string? _folder;

    private PostgresServer(string connectionString, string? folder)
    {
        ConnectionString = connectionString;
        _folder = folder;
    }

    /// <summary>Connection string of the server's <c>postgres</c> database as superuser.</summary>
    public string ConnectionString { get; }

    /// <summary>Loopback port of the server.</summary>
    public int Port => new NpgsqlConnectionStringBuilder(ConnectionString).Port;

    /// <summary>The server shared by every test of this process.</summary>
    public static async Task<PostgresServer> SharedAsync()
    {
        await SharedGate.WaitAsync().ConfigureAwait(false);
        try
        {
            if (_shared is not null)
            {
                return _shared;
            }
            string? given = Environment.GetEnvironmentVariable(EnvironmentVariable);
            if (!string.IsNullOrWhiteSpace(given))
            {
                _shared = new PostgresServer(given, folder: null);
                return _shared;
            }
            var started = await StartOwnAsync().ConfigureAwait(false);
            AppDomain.CurrentDomain.ProcessExit += (_, _) => started.StopCluster();
            _shared = started;
            return _shared;
        }
        finally
        {
            SharedGate.Release();
        }
    }

    /// <summary>Starts a private cluster (for tests that restart or stop the server).</summary>
    public static async Task<PostgresServer> StartOwnAsync()
    {
        string folder = Path.Combine(Path.GetTempPath(), "runwatch-test-pg-" + Guid.NewGuid().ToString("N")[..12]);
        string output = await RunScriptAsync("start", folder).ConfigureAwait(false);
        string connectionString = output.Trim().Split('\n')[^1].Trim();
        return new PostgresServer(connectionString, folder);
    }

    /// <summary>Creates an empty database and returns its connection string (one per test keeps tests apart).</summary>
    public async Task<string> CreateDatabaseAsync(string prefix = "rw")
    {
        string name = string.Create(CultureInfo.InvariantCulture,
            $"{prefix}_{Environment.ProcessId}_{Interlocked.Increment(ref _databaseCounter)}_{Guid.NewGuid().ToString("N")[..6]}");
        await using (var connection = new NpgsqlConnection(ConnectionString))
        {
            await connection.OpenAsync().ConfigureAwait(false);
            await using var command = connection.CreateCommand();
            command.CommandText = "CREATE DATABASE " + name;
            await command.ExecuteNonQueryAsync().ConfigureAwait(false);
        }
        return new NpgsqlConnectionStringBuilder(ConnectionString) { Database = name }.ConnectionString;
    }

    /// <summary>Drops a database made by <see cref="CreateDatabaseAsync"/>, closing whatever still uses it.</summary>
    public async Task DropDatabaseAsync(string databaseConnectionString)
    {
        string name = new NpgsqlConnectionStringBuilder(databaseConnectionString).Database!;
        await using var connection = new NpgsqlConnection(ConnectionString);
        await connection.OpenAsync().ConfigureAwait(false);
        await using var command = connection.CreateCommand();
        command.CommandText = "DROP DATABASE IF EXISTS " + name + " WITH (FORCE)";
        await command.ExecuteNonQueryAsync().ConfigureAwait(false);
    }

    /// <summary>Restarts the server (fast shutdown: open sessions are cut, as in a crash of the clients' view).</summary>
    public Task RestartAsync() => _folder is null
        ? throw new InvalidOperationException("Only a private cluster (StartOwnAsync) can be restarted.")
        : RunScriptAsync("restart", _folder);

    /// <inheritdoc />
    public ValueTask DisposeAsync()
    {
        if (!ReferenceEquals(this, _shared))
        {
            StopCluster();
        }
        return ValueTask.CompletedTask;
    }

    private void StopCluster()
    {
        if (_folder is null)
        {
            return;
        }
        using var process = Process.Start(new ProcessStartInfo("bash", [ScriptPath, "stop", _folder]) { UseShellExecute = false });
        process?.WaitForExit(60_000);
    }

    private static string ScriptPath => Path.Combine(RepositoryRoot.Path, "tests", "postgres-cluster.sh");

    private static async Task<string> RunScriptAsync(string verb, string folder)
    {
        var psi = new ProcessStartInfo("bash", [ScriptPath, verb, folder])
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        using var process = Process.Start(psi) ?? throw new InvalidOperationException("cannot start bash");
        var stdout = process.StandardOutput.ReadToEndAsync();
        var stderr = process.StandardError.ReadToEndAsync();
        using var timeout = new CancellationTokenSource(TimeSpan.FromMinutes(2));
        await process.WaitForExitAsync(timeout.Token).ConfigureAwait(false);
        if (process.ExitCode != 0)
        {
            throw new InvalidOperationException(
                $"PostgreSQL could not be started for the tests ({ScriptPath} {verb} exited with {process.ExitCode}): {await stderr.ConfigureAwait(false)}");
        }
        return await stdout.ConfigureAwait(false);
    }
}
