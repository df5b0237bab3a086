using Microsoft.Extensions.Logging;
using RunWatch.Web.Data;

namespace RunWatch.Web.Live;

/// <summary>
/// In-process fan-out from the ingest to open circuits. Subscribers get each update on the caller's thread and
/// must hop to their own renderer (ComponentBase.InvokeAsync); a failing subscriber is logged and skipped.
/// </summary>
public sealed partial class LiveUpdateHub(ILogger<LiveUpdateHub> logger) : ITelemetryNotifier
{
    private readonly Lock _gate = new();
    private Action<LiveUpdate>[] _subscribers = [];

    /// <summary>Registers a handler; dispose the result to unsubscribe.</summary>
    public IDisposable Subscribe(Action<LiveUpdate> handler)
    {
        ArgumentNullException.ThrowIfNull(handler);
        lock (_gate)
        {
            _subscribers = [.. _subscribers, handler];
        }
        return new Subscription(this, handler);
    }

    /// <summary>Number of live subscriptions (open page components).</summary>
    public int SubscriberCount => Volatile.Read(ref _subscribers).Length;

    public void SamplesCommitted(IReadOnlyList<LiveSample> samples)
    {
        ArgumentNullException.ThrowIfNull(samples);
        foreach (var group in samples.GroupBy(s => s.Chamber, StringComparer.Ordinal))
        {
            Publish(new LiveUpdate(LiveUpdateKind.Samples, group.Key, group.ToList()));
        }
    }

    public void AlertsChanged(string chamber) => Publish(new LiveUpdate(LiveUpdateKind.Alerts, chamber, []));

    public void RunsChanged(string chamber) => Publish(new LiveUpdate(LiveUpdateKind.Runs, chamber, []));

    private void Publish(LiveUpdate update)
    {
        foreach (var subscriber in Volatile.Read(ref _subscribers))
        {
            try
            {
                subscriber(update);
            }
            catch (Exception ex)
            {
                LogSubscriberFailed(logger, ex);
            }
        }
    }

    private void Unsubscribe(Action<LiveUpdate> handler)
    {
        lock (_gate)
        {
            _subscribers = Array.FindAll(_subscribers, s => !ReferenceEquals(s, handler));
        }
    }

    [LoggerMessage(EventId = 6001, Level = LogLevel.Warning, Message = "A dashboard live-update subscriber failed")]
    private static partial void LogSubscriberFailed(ILogger logger, Exception exception);

    private sealed class Subscription(LiveUpdateHub hub, Action<LiveUpdate> handler) : IDisposable
    {
        private int _disposed;

        public void Dispose()
        {
            if (Interlocked.Exchange(ref _disposed, 1) == 0)
            {
                hub.Unsubscribe(handler);
            }
        }
    }
}
