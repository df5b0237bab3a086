using System.Collections.Concurrent;
using System.Globalization;
using System.Net.Sockets;
using System.Text.Json;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Options;
using Npgsql;
using NpgsqlTypes;

namespace RunWatch.Storage.Postgres;

/// <summary>
/// PostgreSQL implementation of the store, for a fleet of daemons sharing one database. Ingest batches go through one
/// dedicated connection per daemon (it keeps its temporary staging table and prepared statements); every other
/// write and every read takes a pooled connection from the data source, so a dashboard or an alert update never
/// waits behind a sample batch. Thread-safe. Failed writes throw <see cref="StoreUnavailableException"/>.
/// </summary>
public sealed partial class PostgresRunWatchStore : IRunWatchStore, IWaferStore, ISettingsStore, IDisposable, IAsyncDisposable
{
    private readonly StorageOptions _options;
    private readonly TimeProvider _timeProvider;
    private readonly ILogger _logger;
    private readonly NpgsqlDataSource _dataSource;
    private readonly NpgsqlConnectionStringBuilder _target;
    private readonly SemaphoreSlim _ingestLock = new(1, 1);
    private readonly ConcurrentDictionary<string, long> _chamberIds = new(StringComparer.Ordinal);
    private readonly ConcurrentDictionary<(long ChamberId, string Channel), long> _channelIds = new();
    private NpgsqlConnection? _ingestConnection;

    /// <summary>Creates the store; nothing is opened until first use.</summary>
    /// <exception cref="ArgumentException">No or an unreadable connection string.</exception>
    public PostgresRunWatchStore(IOptions<StorageOptions> options, TimeProvider timeProvider, ILogger<PostgresRunWatchStore>? logger = null)
    {
        ArgumentNullException.ThrowIfNull(options);
        ArgumentNullException.ThrowIfNull(timeProvider);
        _options = options.Value;
        _timeProvider = timeProvider;
        _logger = (ILogger?)logger ?? NullLogger.Instance;
        if (string.IsNullOrWhiteSpace(_options.ConnectionString))
        {
            throw new ArgumentException("Storage:ConnectionString is required with Storage:Provider=PostgreSql.", nameof(options));
        }
        _target = new NpgsqlConnectionStringBuilder(_options.ConnectionString);
        _dataSource = NpgsqlDataSource.Create(_target.ConnectionString);
    }

    /// <summary>Host, port and database the store talks to (never the password).</summary>
    public string Describe => string.Create(CultureInfo.InvariantCulture, $"{_target.Host}:{_target.Port}/{_target.Database}");

    /// <summary>The connection string, for components that need their own sessions (chamber ownership locks).</summary>
    internal string ConnectionString => _target.ConnectionString;

    /// <inheritdoc />
    public Task<int> MigrateAsync(CancellationToken cancellationToken) =>
        WithConnectionAsync(async connection =>
        {
            int applied = await PostgresMigrator.ApplyAsync(connection, _timeProvider, cancellationToken).ConfigureAwait(false);
            await using var version = new NpgsqlCommand("SELECT COALESCE(MAX(version), 0) FROM schema_migrations", connection);
            int current = Convert.ToInt32(await version.ExecuteScalarAsync(cancellationToken).ConfigureAwait(false), CultureInfo.InvariantCulture);
            PostgresLog.StoreOpened(_logger, _target.Host, _target.Port, _target.Database, applied, current);
            return applied;
        }, cancellationToken, isWrite: true);

    /// <inheritdoc />
    public async Task<IReadOnlyList<RegisteredChamber>> RegisterChambersAsync(IReadOnlyList<ChamberDefinition> chambers, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(chambers);
        var result = await WriteAsync<IReadOnlyList<RegisteredChamber>>(async (connection, transaction) =>
        {
            var registered = new List<RegisteredChamber>(chambers.Count);
            foreach (var chamber in chambers)
            {
                await using var upsertChamber = new NpgsqlCommand("""
                    INSERT INTO chambers (name, site, description) VALUES (@name, @site, @description)
                    ON CONFLICT (name) DO UPDATE SET site = excluded.site, description = excluded.description
                    RETURNING id
                    """, connection, transaction);
                PgParameters.Text(upsertChamber, "name", chamber.Name);
                PgParameters.Text(upsertChamber, "site", chamber.Site);
                PgParameters.Text(upsertChamber, "description", chamber.Description);
                long chamberId = (long)(await upsertChamber.ExecuteScalarAsync(cancellationToken).ConfigureAwait(false))!;
                var channels = new List<RegisteredChannel>(chamber.Channels.Count);
                foreach (var channel in chamber.Channels)
                {
                    await using var upsertChannel = new NpgsqlCommand("""
                        INSERT INTO channels (chamber_id, name, role, unit, min_value, max_value, calibration_json)
                        VALUES (@chamber, @name, @role, @unit, @min, @max, @calibration)
                        ON CONFLICT (chamber_id, name) DO UPDATE SET role = excluded.role, unit = excluded.unit,
                            min_value = excluded.min_value, max_value = excluded.max_value, calibration_json = excluded.calibration_json
                        RETURNING id
                        """, connection, transaction);
                    PgParameters.Long(upsertChannel, "chamber", chamberId);
                    PgParameters.Text(upsertChannel, "name", channel.Name);
                    PgParameters.Text(upsertChannel, "role", channel.Role.ToString());
                    PgParameters.Text(upsertChannel, "unit", channel.Unit);
                    PgParameters.Double(upsertChannel, "min", channel.MinValue);
                    PgParameters.Double(upsertChannel, "max", channel.MaxValue);
                    PgParameters.Text(upsertChannel, "calibration", JsonSerializer.Serialize(channel.Calibration, StorageJsonContext.Default.IReadOnlyListCalibrationPoint));
                    long channelId = (long)(await upsertChannel.ExecuteScalarAsync(cancellationToken).ConfigureAwait(false))!;
                    channels.Add(new RegisteredChannel(chamberId, channelId, channel));
                }
                registered.Add(new RegisteredChamber(chamberId, chamber, channels));
            }
            return registered;
        }, cancellationToken).ConfigureAwait(false);
        foreach (var chamber in result)
        {
            _chamberIds[chamber.Definition.Name] = chamber.ChamberId;
            foreach (var channel in chamber.Channels)
            {
                _channelIds[(chamber.ChamberId, channel.Definition.Name)] = channel.ChannelId;
            }
        }
        return result;
    }

    /// <inheritdoc />
    public Task<IReadOnlyList<RegisteredChamber>> ListChambersAsync(CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<RegisteredChamber>>(async connection =>
        {
            var chambers = new List<(long Id, string Name, string Site, string? Description)>();
            await using (var command = new NpgsqlCommand("SELECT id, name, site, description FROM chambers ORDER BY name COLLATE \"C\"", connection))
            await using (var reader = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false))
            {
                while (await reader.ReadAsync(cancellationToken).ConfigureAwait(false))
                {
                    chambers.Add((reader.GetInt64(0), reader.GetString(1), reader.GetString(2), reader.IsDBNull(3) ? null : reader.GetString(3)));
                }
            }
            var result = new List<RegisteredChamber>(chambers.Count);
            foreach (var (id, name, site, description) in chambers)
            {
                var channels = new List<RegisteredChannel>();
                await using var command = new NpgsqlCommand("SELECT id, name, role, unit, min_value, max_value, calibration_json FROM channels WHERE chamber_id = @c ORDER BY id", connection);
                PgParameters.Long(command, "c", id);
                await using var reader = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
                while (await reader.ReadAsync(cancellationToken).ConfigureAwait(false))
                {
                    var calibration = reader.IsDBNull(6)
                        ? []
                        : JsonSerializer.Deserialize(reader.GetString(6), StorageJsonContext.Default.IReadOnlyListCalibrationPoint) ?? [];
                    var definition = new ChannelDefinition(
                        reader.GetString(1),
                        Enum.Parse<ChannelRole>(reader.GetString(2)),
                        reader.GetString(3),
                        reader.IsDBNull(4) ? null : reader.GetDouble(4),
                        reader.IsDBNull(5) ? null : reader.GetDouble(5),
                        calibration);
                    channels.Add(new RegisteredChannel(id, reader.GetInt64(0), definition));
                }
                result.Add(new RegisteredChamber(id, new ChamberDefinition(name, site, description, channels.ConvertAll(c => c.Definition)), channels));
            }
            return result;
        }, cancellationToken);

    /// <inheritdoc />
    /// <remarks>Nothing to do: PostgreSQL's autovacuum and checkpointer keep the database on their own.</remarks>
    public Task MaintainAsync(CancellationToken cancellationToken) => Task.CompletedTask;

    /// <inheritdoc />
    public Task ProbeWriteAsync(CancellationToken cancellationToken) =>
        WriteAsync(async (connection, transaction) =>
        {
            await using var command = new NpgsqlCommand("""
                INSERT INTO daemon_heartbeat (instance, at_us) VALUES (@instance, @t)
                ON CONFLICT (instance) DO UPDATE SET at_us = excluded.at_us
                """, connection, transaction);
            PgParameters.Text(command, "instance", Environment.MachineName);
            PgParameters.Long(command, "t", UnixMicros.From(_timeProvider.GetUtcNow()));
            return await command.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false);
        }, cancellationToken);

    /// <summary>Closes the ingest connection and the pool.</summary>
    public void Dispose()
    {
        _ingestConnection?.Dispose();
        _ingestConnection = null;
        _dataSource.Dispose();
        _ingestLock.Dispose();
    }

    /// <inheritdoc />
    public async ValueTask DisposeAsync()
    {
        if (_ingestConnection is not null)
        {
            await _ingestConnection.DisposeAsync().ConfigureAwait(false);
            _ingestConnection = null;
        }
        await _dataSource.DisposeAsync().ConfigureAwait(false);
        _ingestLock.Dispose();
    }

    /// <summary>Runs <paramref name="work"/> in a transaction on a pooled connection and commits it.</summary>
    private Task<T> WriteAsync<T>(Func<NpgsqlConnection, NpgsqlTransaction, Task<T>> work, CancellationToken cancellationToken) =>
        WithConnectionAsync(async connection =>
        {
            await using var transaction = await connection.BeginTransactionAsync(cancellationToken).ConfigureAwait(false);
            T result = await work(connection, transaction).ConfigureAwait(false);
            await transaction.CommitAsync(cancellationToken).ConfigureAwait(false);
            return result;
        }, cancellationToken, isWrite: true);

    private Task<T> ReadAsync<T>(Func<NpgsqlConnection, Task<T>> work, CancellationToken cancellationToken) =>
        WithConnectionAsync(work, cancellationToken, isWrite: false);

    private async Task<T> WithConnectionAsync<T>(Func<NpgsqlConnection, Task<T>> work, CancellationToken cancellationToken, bool isWrite)
    {
        try
        {
            await using var connection = await _dataSource.OpenConnectionAsync(cancellationToken).ConfigureAwait(false);
            return await work(connection).ConfigureAwait(false);
        }
        catch (Exception ex) when (IsStoreFailure(ex))
        {
            // Reads too: a server restart or a lost network must reach the callers as the store's own failure, which
            // every service already rides out (a raw NpgsqlException would end the service, and the host with it).
            if (isWrite)
            {
                PostgresLog.WriteFailed(_logger, (ex as PostgresException)?.SqlState ?? ex.GetType().Name, ex);
            }
            throw new StoreUnavailableException((isWrite ? "PostgreSQL write failed: " : "PostgreSQL read failed: ") + ex.Message, ex);
        }
    }

    /// <summary>Server, network and timeout failures; not the caller's own exceptions (unknown ids, conflicts).</summary>
    private static bool IsStoreFailure(Exception ex) => ex is NpgsqlException or IOException or SocketException or TimeoutException;
}
