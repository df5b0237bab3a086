using System.Collections.Concurrent;
using System.Globalization;
using System.Text.Json;
using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Options;

namespace RunWatch.Storage.Sqlite;

/// <summary>
/// SQLite implementation of <see cref="IRunWatchStore"/>: WAL journal, one dedicated writer connection guarded by
/// a semaphore (SQLite has a single writer anyway), a fresh pooled connection per read. Thread-safe.
/// </summary>
public sealed partial class SqliteRunWatchStore : IRunWatchStore, IDisposable
{
    private readonly StorageOptions _options;
    private readonly TimeProvider _timeProvider;
    private readonly ILogger _logger;
    private readonly string _connectionString;
    private readonly SemaphoreSlim _writeLock = new(1, 1);
    private readonly ConcurrentDictionary<string, long> _chamberIds = new(StringComparer.Ordinal);
    private readonly ConcurrentDictionary<(long ChamberId, string Channel), long> _channelIds = new();
    private SqliteConnection? _writer;
    private SQLitePCL.sqlite3_stmt? _insertSample;
    private long _lastWriteTicks;
    private long _lastCheckpointTicks;

    /// <summary>Creates the store; the file and folder are created on first use.</summary>
    public SqliteRunWatchStore(IOptions<StorageOptions> options, TimeProvider timeProvider, ILogger<SqliteRunWatchStore>? logger = null)
    {
        ArgumentNullException.ThrowIfNull(options);
        ArgumentNullException.ThrowIfNull(timeProvider);
        _options = options.Value;
        _timeProvider = timeProvider;
        _logger = (ILogger?)logger ?? NullLogger.Instance;
        _connectionString = new SqliteConnectionStringBuilder
        {
            DataSource = _options.DatabasePath,
            Mode = SqliteOpenMode.ReadWriteCreate,
            Cache = SqliteCacheMode.Private,
            Pooling = true,
            DefaultTimeout = Math.Max(1, (int)_options.BusyTimeout.TotalSeconds),
        }.ToString();
    }

    /// <summary>Full path of the database file.</summary>
    public string DatabasePath => _options.DatabasePath;

    /// <inheritdoc />
    public async Task<int> MigrateAsync(CancellationToken cancellationToken)
    {
        Directory.CreateDirectory(Path.GetDirectoryName(_options.DatabasePath)!);
        return await WriteAsync(connection =>
        {
            int applied = SqliteMigrator.Apply(connection, _timeProvider);
            using var version = connection.CreateCommand();
            version.CommandText = "SELECT COALESCE(MAX(version), 0) FROM schema_migrations";
            int current = Convert.ToInt32(version.ExecuteScalar(), CultureInfo.InvariantCulture);
            Log.StoreOpened(_logger, _options.DatabasePath, applied, current);
            return applied;
        }, cancellationToken).ConfigureAwait(false);
    }

    /// <inheritdoc />
    public async Task<IReadOnlyList<RegisteredChamber>> RegisterChambersAsync(IReadOnlyList<ChamberDefinition> chambers, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(chambers);
        var result = await WriteAsync(connection =>
        {
            using var transaction = connection.BeginTransaction();
            var registered = new List<RegisteredChamber>(chambers.Count);
            foreach (var chamber in chambers)
            {
                using var upsertChamber = connection.CreateCommand();
                upsertChamber.Transaction = transaction;
                upsertChamber.CommandText = """
                    INSERT INTO chambers (name, site, description) VALUES ($name, $site, $description)
                    ON CONFLICT (name) DO UPDATE SET site = excluded.site, description = excluded.description
                    RETURNING id
                    """;
                upsertChamber.Parameters.AddWithValue("$name", chamber.Name);
                upsertChamber.Parameters.AddWithValue("$site", chamber.Site);
                upsertChamber.Parameters.AddWithValue("$description", (object?)chamber.Description ?? DBNull.Value);
                long chamberId = Convert.ToInt64(upsertChamber.ExecuteScalar(), CultureInfo.InvariantCulture);
                var channels = new List<RegisteredChannel>(chamber.Channels.Count);
                foreach (var channel in chamber.Channels)
                {
                    using var upsertChannel = connection.CreateCommand();
                    upsertChannel.Transaction = transaction;
                    upsertChannel.CommandText = """
                        INSERT INTO channels (chamber_id, name, role, unit, min_value, max_value, calibration_json)
                        VALUES ($chamber, $name, $role, $unit, $min, $max, $calibration)
                        ON CONFLICT (chamber_id, name) DO UPDATE SET role = excluded.role, unit = excluded.unit,
                            min_value = excluded.min_value, max_value = excluded.max_value, calibration_json = excluded.calibration_json
                        RETURNING id
                        """;
                    upsertChannel.Parameters.AddWithValue("$chamber", chamberId);
                    upsertChannel.Parameters.AddWithValue("$name", channel.Name);
                    upsertChannel.Parameters.AddWithValue("$role", channel.Role.ToString());
                    upsertChannel.Parameters.AddWithValue("$unit", channel.Unit);
                    upsertChannel.Parameters.AddWithValue("$min", (object?)channel.MinValue ?? DBNull.Value);
                    upsertChannel.Parameters.AddWithValue("$max", (object?)channel.MaxValue ?? DBNull.Value);
                    upsertChannel.Parameters.AddWithValue("$calibration", JsonSerializer.Serialize(channel.Calibration, StorageJsonContext.Default.IReadOnlyListCalibrationPoint));
                    long channelId = Convert.ToInt64(upsertChannel.ExecuteScalar(), CultureInfo.InvariantCulture);
                    channels.Add(new RegisteredChannel(chamberId, channelId, channel));
                }
                registered.Add(new RegisteredChamber(chamberId, chamber, channels));
            }
            transaction.Commit();
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
        ReadAsync<IReadOnlyList<RegisteredChamber>>(connection =>
        {
            var chambers = new List<(long Id, string Name, string Site, string? Description)>();
            using (var command = connection.CreateCommand())
            {
                command.CommandText = "SELECT id, name, site, description FROM chambers ORDER BY name";
                using var reader = command.ExecuteReader();
                while (reader.Read())
                {
                    chambers.Add((reader.GetInt64(0), reader.GetString(1), reader.GetString(2), reader.IsDBNull(3) ? null : reader.GetString(3)));
                }
            }
            var result = new List<RegisteredChamber>(chambers.Count);
            foreach (var (id, name, site, description) in chambers)
            {
                var channels = new List<RegisteredChannel>();
                using var command = connection.CreateCommand();
                command.CommandText = "SELECT id, name, role, unit, min_value, max_value, calibration_json FROM channels WHERE chamber_id = $c ORDER BY id";
                command.Parameters.AddWithValue("$c", id);
                using var reader = command.ExecuteReader();
                while (reader.Read())
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
    public async Task MaintainAsync(CancellationToken cancellationToken)
    {
        long now = _timeProvider.GetTimestamp();
        long lastWrite = Interlocked.Read(ref _lastWriteTicks);
        if (lastWrite == 0 || Interlocked.Read(ref _lastCheckpointTicks) >= lastWrite)
        {
            return;
        }
        var idle = _timeProvider.GetElapsedTime(lastWrite, now);
        if (idle < _options.IdleCheckpointAfter)
        {
            return;
        }
        await WriteAsync(connection =>
        {
            // PASSIVE, never TRUNCATE or RESTART: those wait (up to busy_timeout) for every reader, such as an open
            // dashboard page, while holding the write lock, and the committer would stall behind them. A complete
            // passive checkpoint lets the next write restart the WAL, which journal_size_limit then trims.
            using var command = connection.CreateCommand();
            command.CommandText = "PRAGMA wal_checkpoint(PASSIVE)";
            using var reader = command.ExecuteReader();
            reader.Read();
            Log.Checkpointed(_logger, (long)idle.TotalMilliseconds, reader.GetInt32(1), reader.GetInt32(2));
            Interlocked.Exchange(ref _lastCheckpointTicks, _timeProvider.GetTimestamp());
            return 0;
        }, cancellationToken, countsAsWrite: false).ConfigureAwait(false);
    }

    /// <inheritdoc />
    public Task ProbeWriteAsync(CancellationToken cancellationToken) =>
        WriteAsync(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = "UPDATE daemon_heartbeat SET at_us = $t WHERE id = 1";
            command.Parameters.AddWithValue("$t", UnixMicros.From(_timeProvider.GetUtcNow()));
            return command.ExecuteNonQuery();
        }, cancellationToken, countsAsWrite: false);

    /// <summary>Closes the writer connection.</summary>
    public void Dispose()
    {
        DropWriter();
        _writeLock.Dispose();
    }

    private async Task<T> WriteAsync<T>(Func<SqliteConnection, T> work, CancellationToken cancellationToken, bool countsAsWrite = true)
    {
        await _writeLock.WaitAsync(cancellationToken).ConfigureAwait(false);
        try
        {
            var connection = _writer ??= OpenWriter();
            T result = work(connection);
            if (countsAsWrite)
            {
                Interlocked.Exchange(ref _lastWriteTicks, _timeProvider.GetTimestamp());
            }
            return result;
        }
        catch (SqliteException ex)
        {
            Log.WriteFailed(_logger, ex.SqliteErrorCode, ex);
            DropWriter();
            throw new StoreUnavailableException("SQLite write failed: " + ex.Message, ex);
        }
        catch (IOException ex)
        {
            DropWriter();
            throw new StoreUnavailableException("SQLite write failed: " + ex.Message, ex);
        }
        catch (UnauthorizedAccessException ex)
        {
            DropWriter();
            throw new StoreUnavailableException("SQLite write failed: " + ex.Message, ex);
        }
        finally
        {
            _writeLock.Release();
        }
    }

    private Task<T> ReadAsync<T>(Func<SqliteConnection, T> work, CancellationToken cancellationToken)
    {
        cancellationToken.ThrowIfCancellationRequested();
        using var connection = new SqliteConnection(_connectionString);
        connection.Open();
        return Task.FromResult(work(connection));
    }

    private SqliteConnection OpenWriter()
    {
        Directory.CreateDirectory(Path.GetDirectoryName(_options.DatabasePath)!);
        var connection = new SqliteConnection(_connectionString);
        try
        {
            connection.Open();
            using var pragma = connection.CreateCommand();
            string synchronous = string.Equals(_options.Synchronous, "Normal", StringComparison.OrdinalIgnoreCase) ? "NORMAL" : "FULL";
            pragma.CommandText = string.Create(CultureInfo.InvariantCulture,
                $"PRAGMA journal_mode=WAL; PRAGMA synchronous={synchronous}; PRAGMA journal_size_limit={_options.JournalSizeLimitBytes}; PRAGMA busy_timeout={(long)_options.BusyTimeout.TotalMilliseconds};");
            pragma.ExecuteNonQuery();
            return connection;
        }
        catch
        {
            connection.Dispose();
            throw;
        }
    }

    private void DropWriter()
    {
        _insertSample?.Dispose();
        _insertSample = null;
        _writer?.Dispose();
        _writer = null;
    }
}
