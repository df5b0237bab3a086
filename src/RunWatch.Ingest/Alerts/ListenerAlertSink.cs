namespace RunWatch.Ingest.Alerts;

/// <summary>Hands alert changes to the registered <see cref="IAlertListener"/>s (the dashboard's live push).</summary>
internal sealed class ListenerAlertSink(IEnumerable<IAlertListener> listeners) : IAlertSink
{
    private readonly IAlertListener[] _listeners = [.. listeners];

    public string Name => "live";

    public Task SendAsync(AlertNotification notification, CancellationToken cancellationToken)
    {
        foreach (IAlertListener listener in _listeners)
        {
            listener.AlertChanged(notification.Alert, notification.Change);
        }
        return Task.CompletedTask;
    }
}
