namespace RunWatch.Web.Data;

/// <summary>
/// The write actions the dashboard offers. Callers check the user's role first; implementations record every
/// action in the audit log with the user's name. Unknown ids throw <see cref="KeyNotFoundException"/>; an action
/// that does not apply in the current state throws <see cref="InvalidOperationException"/> with a plain message.
/// </summary>
public interface IDashboardCommands
{
    Task AcknowledgeAlertAsync(string alertId, string user, string comment, CancellationToken cancellationToken);

    Task ShelveAlertAsync(string alertId, string user, string comment, DateTimeOffset until, CancellationToken cancellationToken);

    Task AssignFieldAsync(string fieldId, string waferId, string user, CancellationToken cancellationToken);

    /// <summary>Refits the process's models on the data now stored; the result becomes the candidate.</summary>
    Task RefitModelAsync(string process, string user, CancellationToken cancellationToken);

    /// <summary>Makes the candidate fit the process's model in force.</summary>
    Task AcceptModelAsync(string process, string user, CancellationToken cancellationToken);

    Task UpdateSpecAsync(SpecEntry spec, string user, CancellationToken cancellationToken);

    /// <summary>Appends an entry to the audit log (used for reminder showings and rule edits).</summary>
    Task RecordAuditAsync(AuditEntry entry, CancellationToken cancellationToken);
}
