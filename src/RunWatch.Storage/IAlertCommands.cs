namespace RunWatch.Storage;

/// <summary>
/// What an operator can do to an alert (the dashboard calls it; the daemon implements it and keeps the ISA-18.2
/// lifecycle consistent with the live alarm). Each action is written to the audit trail.
/// </summary>
public interface IAlertCommands
{
    /// <summary>Acknowledges the alert; false when it is unknown or has nothing to acknowledge.</summary>
    Task<bool> AcknowledgeAsync(long alertId, string user, CancellationToken cancellationToken);

    /// <summary>Shelves the alert for <paramref name="duration"/>; false when it is unknown or already normal.</summary>
    Task<bool> ShelveAsync(long alertId, TimeSpan duration, string user, CancellationToken cancellationToken);
}
