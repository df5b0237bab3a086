namespace RunWatch.Storage;

/// <summary>
/// What an operator can do to an alert (the dashboard calls it; the daemon implements it and keeps the ISA-18.2
/// lifecycle consistent with the live alarm). Each action is written to the audit trail as one entry, with the
/// operator's comment in it.
/// </summary>
public interface IAlertCommands
{
    /// <summary>Acknowledges the alert; false when it is unknown or has nothing to acknowledge.</summary>
    Task<bool> AcknowledgeAsync(long alertId, string user, CancellationToken cancellationToken) =>
        AcknowledgeAsync(alertId, user, null, cancellationToken);

    /// <summary>Acknowledges the alert with the operator's comment in the same audit entry; false when there is nothing to acknowledge.</summary>
    Task<bool> AcknowledgeAsync(long alertId, string user, string? comment, CancellationToken cancellationToken);

    /// <summary>Shelves the alert for <paramref name="duration"/>; false when it is unknown or already normal.</summary>
    Task<bool> ShelveAsync(long alertId, TimeSpan duration, string user, CancellationToken cancellationToken) =>
        ShelveAsync(alertId, duration, user, null, cancellationToken);

    /// <summary>Shelves the alert with the operator's reason in the same audit entry; false when it is unknown or already normal.</summary>
    Task<bool> ShelveAsync(long alertId, TimeSpan duration, string user, string? comment, CancellationToken cancellationToken);
}
