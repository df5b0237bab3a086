namespace RunWatch.Ingest.Alerts;

/// <summary>Somewhere alerts go. Each sink has its own queue, so a slow one holds up no other.</summary>
internal interface IAlertSink
{
    string Name { get; }

    Task SendAsync(AlertNotification notification, CancellationToken cancellationToken);
}
