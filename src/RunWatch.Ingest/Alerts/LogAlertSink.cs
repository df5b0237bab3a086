using Microsoft.Extensions.Logging;

namespace RunWatch.Ingest.Alerts;

/// <summary>Writes alert changes to the log.</summary>
internal sealed class LogAlertSink(ILogger<LogAlertSink> logger) : IAlertSink
{
    public string Name => "log";

    public Task SendAsync(AlertNotification notification, CancellationToken cancellationToken)
    {
        var a = notification.Alert;
        Log.AlertChanged(logger, a.Kind, a.Chamber ?? "daemon", notification.Change, a.Message);
        return Task.CompletedTask;
    }
}
