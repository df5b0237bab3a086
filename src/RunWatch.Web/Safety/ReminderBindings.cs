using System.Collections.Concurrent;
using RunWatch.Core.Safety;
using RunWatch.Storage;
using RunWatch.Web.Data;

namespace RunWatch.Web.Safety;

/// <summary>
/// Which channel each reminder role reads on each chamber: the chamber configuration's channel roles, replaced where
/// an admin chose another channel (or none) on the Settings page. Edits are audited; with a binding store they are
/// written with their audit entry in one transaction and survive a restart (<see cref="LoadAsync"/>), without one
/// they hold until restart. The caller checks the admin role. Thread-safe.
/// </summary>
public sealed class ReminderBindings(IDashboardCommands commands, DashboardClock clock, IReminderBindingStore? store = null)
{
    private readonly ConcurrentDictionary<(string Chamber, ReminderChannelRole Role), ReminderBinding> _overrides = new();

    /// <summary>The roles a reminder can read, in display order.</summary>
    public static IReadOnlyList<ReminderChannelRole> Roles { get; } = [.. Enum.GetValues<ReminderChannelRole>().Where(r => r != ReminderChannelRole.None)];

    /// <summary>Whether edits are kept across restarts.</summary>
    public bool IsPersisted => store is not null;

    /// <summary>Puts the stored bindings in force (at start).</summary>
    public async Task LoadAsync(CancellationToken cancellationToken)
    {
        if (store is null)
        {
            return;
        }
        foreach (ReminderBinding b in await store.GetReminderBindingsAsync(cancellationToken).ConfigureAwait(false))
        {
            // A role name this version does not know is ignored rather than guessed.
            if (Enum.TryParse(b.Role, out ReminderChannelRole role) && role != ReminderChannelRole.None)
            {
                _overrides[(b.Chamber, role)] = b;
            }
        }
    }

    /// <summary>The admin's binding of the role on the chamber, or null when the configured channel applies.</summary>
    public ReminderBinding? Override(string chamber, ReminderChannelRole role) =>
        _overrides.TryGetValue((chamber, role), out var b) ? b : null;

    /// <summary>The channel of each mapped role on the chamber, overrides applied.</summary>
    public IReadOnlyDictionary<ReminderChannelRole, string> Effective(ChamberStatus chamber)
    {
        ArgumentNullException.ThrowIfNull(chamber);
        var map = new Dictionary<ReminderChannelRole, string>();
        if (chamber.ConfiguredRoles is { } configured)
        {
            foreach (var (role, channel) in configured)
            {
                map[role] = channel;
            }
        }
        foreach (var ((name, role), binding) in _overrides)
        {
            if (name != chamber.Chamber)
            {
                continue;
            }
            if (binding.Channel is { } channel)
            {
                map[role] = channel;
            }
            else
            {
                map.Remove(role);
            }
        }
        return map;
    }

    /// <summary>
    /// Binds the role to <paramref name="channel"/> on the chamber (null: no channel, so its reminders are not
    /// watched there), in the name of <paramref name="user"/>, with an audit entry (old → new).
    /// </summary>
    /// <exception cref="ArgumentException">The role is None, or the channel is not one of the chamber's; nothing is changed.</exception>
    public async Task SetAsync(ChamberStatus chamber, ReminderChannelRole role, string? channel, string user, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(chamber);
        ArgumentException.ThrowIfNullOrWhiteSpace(user);
        if (role == ReminderChannelRole.None)
        {
            throw new ArgumentException("Not saved: choose a channel role.");
        }
        if (channel is not null && chamber.Channels is { } known && !known.Contains(channel, StringComparer.Ordinal))
        {
            throw new ArgumentException($"Not saved: chamber {chamber.Chamber} has no channel '{channel}'.");
        }
        string before = Describe(Effective(chamber).TryGetValue(role, out string? old) ? old : null);
        var binding = new ReminderBinding(chamber.Chamber, role.ToString(), channel, clock.Now, user);
        string detail = $"{role}: {before} → {Describe(channel)}";
        await WriteAsync(binding, detail, cancellationToken).ConfigureAwait(false);
        _overrides[(chamber.Chamber, role)] = binding;
    }

    /// <summary>Removes the admin's binding: the channel configured with the role applies again. Audited; false when there was none.</summary>
    public async Task<bool> ResetAsync(ChamberStatus chamber, ReminderChannelRole role, string user, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(chamber);
        ArgumentException.ThrowIfNullOrWhiteSpace(user);
        if (!_overrides.TryGetValue((chamber.Chamber, role), out var current))
        {
            return false;
        }
        string configured = Describe(chamber.ConfiguredRoles is { } c && c.TryGetValue(role, out string? ch) ? ch : null);
        string detail = $"{role}: {Describe(current.Channel)} → as configured ({configured})";
        DateTimeOffset now = clock.Now;
        string subject = Subject(chamber.Chamber, role);
        if (store is not null)
        {
            await store.RemoveReminderBindingAsync(chamber.Chamber, role.ToString(),
                new Storage.AuditEntry(now, user, "reminder binding reset", subject, AuditDetail.Json(detail)), cancellationToken).ConfigureAwait(false);
        }
        else
        {
            await commands.RecordAuditAsync(new Data.AuditEntry(now, user, "reminder binding reset", subject, detail), cancellationToken).ConfigureAwait(false);
        }
        _overrides.TryRemove((chamber.Chamber, role), out _);
        return true;
    }

    private async Task WriteAsync(ReminderBinding binding, string detail, CancellationToken cancellationToken)
    {
        string subject = binding.Chamber + " / " + binding.Role;
        // Same subject form as Subject(chamber, role): the role's name.
        if (store is not null)
        {
            await store.SaveReminderBindingAsync(binding,
                new Storage.AuditEntry(binding.UpdatedAt, binding.UpdatedBy, "reminder binding edited", subject, AuditDetail.Json(detail)), cancellationToken).ConfigureAwait(false);
        }
        else
        {
            await commands.RecordAuditAsync(new Data.AuditEntry(binding.UpdatedAt, binding.UpdatedBy, "reminder binding edited", subject, detail), cancellationToken).ConfigureAwait(false);
        }
    }

    private static string Subject(string chamber, ReminderChannelRole role) => chamber + " / " + role;

    private static string Describe(string? channel) => channel ?? "no channel";
}
