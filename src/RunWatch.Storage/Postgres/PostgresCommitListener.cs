using System.Globalization;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Logging.Abstractions;
using Npgsql;

namespace RunWatch.Storage.Postgres;

/// <summary>
/// LISTENs on a dedicated connection for the commit notifications of other store instances sharing the database
/// (other daemons of a fleet) and hands each committed range, read back from the store, to a callback. The store's
/// own notifications are skipped: its daemon already pushed those samples itself. After a lost connection it
/// listens again; ranges committed while it was away are not delivered (pages show them on their next read).
/// </summary>
public sealed class PostgresCommitListener(PostgresRunWatchStore store, TimeProvider timeProvider, ILogger<PostgresCommitListener>? logger = null)
{
    /// <summary>Most samples delivered for one channel of one notification (a live page needs the recent ones only).</summary>
    public const int MaxSamplesPerRange = 20_000;

    private static readonly TimeSpan RetryDelay = TimeSpan.FromSeconds(2);
    private readonly ILogger _logger = (ILogger?)logger ?? NullLogger.Instance;
    private readonly TaskCompletionSource _listening = new(TaskCreationOptions.RunContinuationsAsynchronously);

    /// <summary>Completes once the first LISTEN is in place (tests wait for it before committing).</summary>
    public Task Listening => _listening.Task;

    /// <summary>Listens until cancelled; calls <paramref name="onCommitted"/> on the listener's own task.</summary>
    public async Task RunAsync(Action<CommittedSamples> onCommitted, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(onCommitted);
        while (!cancellationToken.IsCancellationRequested)
        {
            try
            {
                await ListenOnceAsync(onCommitted, cancellationToken).ConfigureAwait(false);
            }
            catch (OperationCanceledException) when (cancellationToken.IsCancellationRequested)
            {
                return;
            }
            catch (Exception ex) when (ex is NpgsqlException or IOException or TimeoutException or StoreUnavailableException)
            {
                PostgresLog.ListenerFailed(_logger, ex);
                try
                {
                    await Task.Delay(RetryDelay, timeProvider, cancellationToken).ConfigureAwait(false);
                }
                catch (OperationCanceledException)
                {
                    return;
                }
            }
        }
    }

    private async Task ListenOnceAsync(Action<CommittedSamples> onCommitted, CancellationToken cancellationToken)
    {
        // Own connection outside the pool: LISTEN belongs to a session, and keepalives let a dead server end the wait.
        var builder = new NpgsqlConnectionStringBuilder(store.ConnectionString) { Pooling = false, KeepAlive = 10 };
        await using var connection = new NpgsqlConnection(builder.ConnectionString);
        var pending = new List<string>();
        connection.Notification += (_, e) => pending.Add(e.Payload);
        await connection.OpenAsync(cancellationToken).ConfigureAwait(false);
        await using (var listen = new NpgsqlCommand("LISTEN " + PostgresRunWatchStore.CommitChannel, connection))
        {
            await listen.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false);
        }
        _listening.TrySetResult();
        while (true)
        {
            await connection.WaitAsync(cancellationToken).ConfigureAwait(false);
            // Notifications arrive on this task inside WaitAsync; read their samples after it returns.
            string[] payloads = [.. pending];
            pending.Clear();
            foreach (string payload in payloads)
            {
                await DeliverAsync(payload, onCommitted, cancellationToken).ConfigureAwait(false);
            }
        }
    }

    private async Task DeliverAsync(string payload, Action<CommittedSamples> onCommitted, CancellationToken cancellationToken)
    {
        string[] parts = payload.Split(';');
        if (parts[0] == store.NotifySource)
        {
            return;
        }
        for (int i = 1; i < parts.Length; i++)
        {
            string[] fields = parts[i].Split(',');
            if (fields.Length != 4
                || !long.TryParse(fields[0], NumberStyles.Integer, CultureInfo.InvariantCulture, out long chamber)
                || !long.TryParse(fields[1], NumberStyles.Integer, CultureInfo.InvariantCulture, out long channel)
                || !long.TryParse(fields[2], NumberStyles.Integer, CultureInfo.InvariantCulture, out long from)
                || !long.TryParse(fields[3], NumberStyles.Integer, CultureInfo.InvariantCulture, out long to))
            {
                PostgresLog.NotificationUnreadable(_logger, payload.Length);
                return;
            }
            var committed = await store.ReadCommittedAsync(chamber, channel, from, to, MaxSamplesPerRange, cancellationToken).ConfigureAwait(false);
            if (committed is { Samples.Count: > 0 })
            {
                onCommitted(committed);
            }
        }
    }
}
