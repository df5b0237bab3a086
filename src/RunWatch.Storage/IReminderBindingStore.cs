namespace RunWatch.Storage;

/// <summary>
/// Per-chamber reminder role bindings set on the dashboard (they override the channel roles of the chamber
/// configuration). Each change is written together with its audit entry in one transaction. Thread-safe.
/// </summary>
public interface IReminderBindingStore
{
    /// <summary>All stored bindings, ordered by chamber and role.</summary>
    Task<IReadOnlyList<ReminderBinding>> GetReminderBindingsAsync(CancellationToken cancellationToken);

    /// <summary>Stores (inserts or replaces) the binding and appends <paramref name="audit"/> in the same transaction.</summary>
    Task SaveReminderBindingAsync(ReminderBinding binding, AuditEntry audit, CancellationToken cancellationToken);

    /// <summary>Removes the chamber's binding of the role (the configured channel applies again) and appends <paramref name="audit"/>; false when none was stored.</summary>
    Task<bool> RemoveReminderBindingAsync(string chamber, string role, AuditEntry audit, CancellationToken cancellationToken);
}
