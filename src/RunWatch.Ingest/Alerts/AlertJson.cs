namespace RunWatch.Ingest.Alerts;

/// <summary>The JSON an alert change is sent as (MQTT alert topic and webhook). Versioned by <see cref="Version"/>.</summary>
internal sealed record AlertJson(
    int Version,
    string Change,
    long Id,
    string Key,
    string? Chamber,
    long? RunId,
    string Kind,
    string Severity,
    string State,
    string Message,
    DateTimeOffset RaisedAt,
    DateTimeOffset? AcknowledgedAt,
    string? AcknowledgedBy,
    DateTimeOffset? ClearedAt,
    double? Value)
{
    public static AlertJson From(AlertNotification n) => new(1, n.Change, n.Alert.Id, n.Alert.Key, n.Alert.Chamber, n.Alert.RunId, n.Alert.Kind,
        n.Alert.Severity.ToString().ToLowerInvariant(), n.Alert.State.ToString(), n.Alert.Message, n.Alert.RaisedAt, n.Alert.AcknowledgedAt,
        n.Alert.AcknowledgedBy, n.Alert.ClearedAt, n.Alert.PeakValue);
}
