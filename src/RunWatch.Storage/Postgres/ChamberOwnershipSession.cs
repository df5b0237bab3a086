using System.Globalization;
using Npgsql;

namespace RunWatch.Storage.Postgres;

/// <summary>
/// One daemon's claim on chambers: a session-level advisory lock per chamber, <c>pg_try_advisory_lock(namespace,
/// chamber id)</c>, held on one dedicated connection opened with <c>Pooling=false</c> (a pooled connection can go back
/// to the pool with its locks still held, npgsql#5592) and kept open for as long as ownership should last. The
/// server releases every lock of the session when it ends: at once when the process dies (its socket closes), and
/// after the TCP keepalive settings (sent as session options) when the host is cut off. The client probes its own
/// session (<see cref="VerifyAsync"/>); a failed probe means every lock is gone. Not thread-safe: one owner loop.
/// </summary>
public sealed class ChamberOwnershipSession : IAsyncDisposable
{
    /// <summary>First key of every ownership lock ("RW"), so that they cannot collide with other advisory locks.</summary>
    public const int LockNamespace = 0x5257;

    /// <summary>Prefix of the application name of ownership sessions (the fleet view reads the instance name after it).</summary>
    public const string ApplicationNamePrefix = "runwatch-owner:";

    private readonly string _connectionString;
    private readonly HashSet<long> _owned = [];
    private NpgsqlConnection? _connection;

    /// <summary>Prepares the session; nothing is opened until the first call.</summary>
    /// <param name="storeConnectionString">The store's connection string (same server and database).</param>
    /// <param name="instance">This daemon's instance name, shown to the fleet as the owner.</param>
    /// <param name="keepAlive">Client keepalive query interval and the server's TCP keepalive idle time.</param>
    /// <param name="commandTimeout">Longest a probe or claim may take before the session counts as lost.</param>
    public ChamberOwnershipSession(string storeConnectionString, string instance, TimeSpan keepAlive, TimeSpan commandTimeout)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(storeConnectionString);
        ArgumentException.ThrowIfNullOrWhiteSpace(instance);
        int keepAliveSeconds = Math.Max(1, (int)keepAlive.TotalSeconds);
        var builder = new NpgsqlConnectionStringBuilder(storeConnectionString)
        {
            Pooling = false,
            KeepAlive = keepAliveSeconds,
            TcpKeepAlive = true,
            ApplicationName = ApplicationNamePrefix + instance,
            CommandTimeout = Math.Max(1, (int)commandTimeout.TotalSeconds),
            Timeout = Math.Max(1, (int)commandTimeout.TotalSeconds),
            // The server probes the client too, so that a host cut off without closing its socket loses its locks
            // after idle + interval x count seconds instead of the kernel's two hours.
            Options = string.Create(CultureInfo.InvariantCulture,
                $"-c tcp_keepalives_idle={keepAliveSeconds} -c tcp_keepalives_interval={Math.Max(1, keepAliveSeconds / 2)} -c tcp_keepalives_count=3"),
        };
        _connectionString = builder.ConnectionString;
        Instance = instance;
    }

    /// <summary>This daemon's instance name.</summary>
    public string Instance { get; }

    /// <summary>Chamber ids whose lock this session holds (as far as the last call knew).</summary>
    public IReadOnlyCollection<long> Owned => _owned;

    /// <summary>Takes the chamber's lock if nobody holds it; true when this session holds it afterwards.</summary>
    /// <exception cref="StoreUnavailableException">The server cannot be reached; every lock is counted lost.</exception>
    public async Task<bool> TryAcquireAsync(long chamberId, CancellationToken cancellationToken)
    {
        if (_owned.Contains(chamberId))
        {
            return true;
        }
        bool taken = await RunAsync(async connection =>
        {
            await using var command = new NpgsqlCommand("SELECT pg_try_advisory_lock(@ns, @chamber)", connection);
            command.Parameters.AddWithValue("ns", LockNamespace);
            command.Parameters.AddWithValue("chamber", checked((int)chamberId));
            return (bool)(await command.ExecuteScalarAsync(cancellationToken).ConfigureAwait(false))!;
        }).ConfigureAwait(false);
        if (taken)
        {
            _owned.Add(chamberId);
        }
        return taken;
    }

    /// <summary>Gives a chamber up (for a clean stop or a rebalance).</summary>
    public async Task ReleaseAsync(long chamberId, CancellationToken cancellationToken)
    {
        if (!_owned.Remove(chamberId) || _connection is null)
        {
            return;
        }
        await RunAsync(async connection =>
        {
            await using var command = new NpgsqlCommand("SELECT pg_advisory_unlock(@ns, @chamber)", connection);
            command.Parameters.AddWithValue("ns", LockNamespace);
            command.Parameters.AddWithValue("chamber", checked((int)chamberId));
            return (bool)(await command.ExecuteScalarAsync(cancellationToken).ConfigureAwait(false))!;
        }).ConfigureAwait(false);
    }

    /// <summary>
    /// Asks the server which ownership locks this session holds and returns them; a session that is gone (server
    /// restarted, connection cut, keepalive failed) holds none, and <see cref="Owned"/> becomes empty.
    /// </summary>
    public async Task<IReadOnlyCollection<long>> VerifyAsync(CancellationToken cancellationToken)
    {
        if (_connection is null)
        {
            _owned.Clear();
            return _owned;
        }
        try
        {
            var held = await RunAsync(async connection =>
            {
                await using var command = new NpgsqlCommand(
                    "SELECT objid::bigint FROM pg_locks WHERE locktype = 'advisory' AND pid = pg_backend_pid() AND classid = @ns AND objsubid = 2 AND granted",
                    connection);
                command.Parameters.AddWithValue("ns", (long)LockNamespace);
                var ids = new HashSet<long>();
                await using var reader = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
                while (await reader.ReadAsync(cancellationToken).ConfigureAwait(false))
                {
                    ids.Add(reader.GetInt64(0));
                }
                return ids;
            }).ConfigureAwait(false);
            _owned.IntersectWith(held);
        }
        catch (StoreUnavailableException)
        {
            _owned.Clear();
        }
        return _owned;
    }

    /// <summary>Every chamber's current owner in the fleet, read from the server's lock table.</summary>
    /// <exception cref="StoreUnavailableException">The server cannot be reached.</exception>
    public static async Task<IReadOnlyList<ChamberOwner>> ReadOwnersAsync(string storeConnectionString, CancellationToken cancellationToken)
    {
        try
        {
            return await ReadOwnersCoreAsync(storeConnectionString, cancellationToken).ConfigureAwait(false);
        }
        catch (Exception ex) when (ex is NpgsqlException or IOException or System.Net.Sockets.SocketException or TimeoutException)
        {
            throw new StoreUnavailableException("Cannot read chamber owners: " + ex.Message, ex);
        }
    }

    private static async Task<IReadOnlyList<ChamberOwner>> ReadOwnersCoreAsync(string storeConnectionString, CancellationToken cancellationToken)
    {
        await using var connection = new NpgsqlConnection(storeConnectionString);
        await connection.OpenAsync(cancellationToken).ConfigureAwait(false);
        await using var command = new NpgsqlCommand("""
            SELECT l.objid::bigint, a.application_name, a.backend_start
            FROM pg_locks l JOIN pg_stat_activity a ON a.pid = l.pid
            WHERE l.locktype = 'advisory' AND l.classid = @ns AND l.objsubid = 2 AND l.granted AND l.database = (SELECT oid FROM pg_database WHERE datname = current_database())
            ORDER BY 1
            """, connection);
        command.Parameters.AddWithValue("ns", (long)LockNamespace);
        var owners = new List<ChamberOwner>();
        await using var reader = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
        while (await reader.ReadAsync(cancellationToken).ConfigureAwait(false))
        {
            string application = reader.IsDBNull(1) ? "" : reader.GetString(1);
            string instance = application.StartsWith(ApplicationNamePrefix, StringComparison.Ordinal) ? application[ApplicationNamePrefix.Length..] : application;
            owners.Add(new ChamberOwner(reader.GetInt64(0), instance, reader.GetFieldValue<DateTimeOffset>(2)));
        }
        return owners;
    }

    /// <summary>Closes the session: the server releases every lock of it.</summary>
    public async ValueTask DisposeAsync()
    {
        _owned.Clear();
        if (_connection is not null)
        {
            await _connection.DisposeAsync().ConfigureAwait(false);
            _connection = null;
        }
    }

    private async Task<T> RunAsync<T>(Func<NpgsqlConnection, Task<T>> work)
    {
        try
        {
            if (_connection is null)
            {
                _owned.Clear();
                var connection = new NpgsqlConnection(_connectionString);
                try
                {
                    await connection.OpenAsync().ConfigureAwait(false);
                }
                catch
                {
                    await connection.DisposeAsync().ConfigureAwait(false);
                    throw;
                }
                _connection = connection;
            }
            return await work(_connection).ConfigureAwait(false);
        }
        catch (Exception ex) when (ex is NpgsqlException or IOException or System.Net.Sockets.SocketException or TimeoutException)
        {
            // The session is gone or unusable: so are its locks. A new session starts on the next call.
            _owned.Clear();
            if (_connection is not null)
            {
                await _connection.DisposeAsync().ConfigureAwait(false);
                _connection = null;
            }
            throw new StoreUnavailableException("Ownership session lost: " + ex.Message, ex);
        }
    }
}
