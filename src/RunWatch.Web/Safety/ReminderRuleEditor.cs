using System.Globalization;
using RunWatch.Core.Safety;
using RunWatch.Storage;
using RunWatch.Web.Data;

namespace RunWatch.Web.Safety;

/// <summary>
/// Admin edits of reminder thresholds. With a settings store the edit and its audit entry are written in one
/// transaction and survive a restart (<see cref="LoadAsync"/> puts the stored thresholds in force at start); without
/// one (in-memory hosts) the edit holds until restart and the audit entry goes through the dashboard's commands.
/// The caller checks the admin role.
/// </summary>
public sealed class ReminderRuleEditor(ReminderRuleSet rules, IDashboardCommands commands, DashboardClock clock, ISettingsStore? store = null)
{
    /// <summary>Actor recorded for seeded settings.</summary>
    public const string SeedActor = "configuration";

    /// <summary>Whether edits are kept across restarts.</summary>
    public bool IsPersisted => store is not null;

    /// <summary>Whether the rule's condition has a threshold an admin may edit.</summary>
    public static bool HasThreshold(ReminderRule rule)
    {
        ArgumentNullException.ThrowIfNull(rule);
        return rule.Kind is ReminderConditionKind.ChannelAbove or ReminderConditionKind.ChannelBelow or ReminderConditionKind.RunEndedAndChannelAbove;
    }

    /// <summary>Seeds the store with the rules in force (defaults) where it has none, then puts the stored thresholds in force.</summary>
    public async Task LoadAsync(CancellationToken cancellationToken)
    {
        if (store is null)
        {
            return;
        }
        DateTimeOffset now = clock.Now;
        var defaults = rules.Rules.Select(r => new ReminderSetting(r.Id, r.Threshold, r.Unit, r.Window, now, SeedActor)).ToList();
        await store.SeedReminderSettingsAsync(defaults, cancellationToken).ConfigureAwait(false);
        foreach (ReminderSetting s in await store.GetReminderSettingsAsync(cancellationToken).ConfigureAwait(false))
        {
            ReminderRule? rule = rules.Rules.FirstOrDefault(r => r.Id == s.RuleId);
            // A stored threshold counts only for the same rule in the same unit; a rule whose unit changed keeps its default.
            if (rule is not null && s.Unit == rule.Unit && double.IsFinite(s.Threshold))
            {
                rules.Replace(rule with { Threshold = s.Threshold });
            }
        }
    }

    /// <summary>Sets a rule's threshold in the name of <paramref name="user"/>, with an audit entry (old → new).</summary>
    /// <exception cref="KeyNotFoundException">No rule has that id.</exception>
    /// <exception cref="ArgumentException">The rule has no threshold, or the value is not a valid one in its unit; nothing is changed.</exception>
    public async Task<ReminderRule> UpdateThresholdAsync(string ruleId, double threshold, string user, CancellationToken cancellationToken)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(user);
        ReminderRule rule = rules.Rules.FirstOrDefault(r => r.Id == ruleId) ?? throw new KeyNotFoundException($"No reminder rule '{ruleId}'.");
        if (!HasThreshold(rule))
        {
            throw new ArgumentException($"Not saved: the reminder '{rule.Title}' has no threshold.");
        }
        if (!double.IsFinite(threshold))
        {
            throw new ArgumentException($"Not saved: the threshold of '{rule.Title}' must be a finite number in {rule.Unit}.");
        }
        if (rule.Unit is "°C" or "degC" && threshold < -273.15)
        {
            throw new ArgumentException($"Not saved: {threshold.ToString(CultureInfo.InvariantCulture)} °C is below absolute zero.");
        }
        if (rule.Unit is "sccm" or "slm" or "K" && threshold < 0)
        {
            throw new ArgumentException($"Not saved: a threshold in {rule.Unit} cannot be negative.");
        }
        DateTimeOffset now = clock.Now;
        string detail = string.Create(CultureInfo.InvariantCulture, $"threshold {rule.Threshold} → {threshold} {rule.Unit}");
        if (store is not null)
        {
            // Normally seeded at start (LoadAsync); a host that skipped it gets the rule's row now.
            await store.SeedReminderSettingsAsync([new ReminderSetting(rule.Id, rule.Threshold, rule.Unit, rule.Window, now, SeedActor)], cancellationToken).ConfigureAwait(false);
            await store.SaveReminderSettingAsync(new ReminderSetting(rule.Id, threshold, rule.Unit, rule.Window, now, user),
                new Storage.AuditEntry(now, user, "reminder edited", rule.Id, AuditDetail.Json(detail)), cancellationToken).ConfigureAwait(false);
        }
        else
        {
            await commands.RecordAuditAsync(new Data.AuditEntry(now, user, "reminder edited", rule.Id, detail), cancellationToken).ConfigureAwait(false);
        }
        ReminderRule updated = rule with { Threshold = threshold };
        rules.Replace(updated);
        return updated;
    }
}
