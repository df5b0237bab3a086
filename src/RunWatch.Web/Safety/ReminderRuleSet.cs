using RunWatch.Core.Safety;

namespace RunWatch.Web.Safety;

/// <summary>The reminder rules in force; admins may replace one (the caller records the audit entry). Thread-safe.</summary>
public sealed class ReminderRuleSet(IReadOnlyList<ReminderRule> initial)
{
    private IReadOnlyList<ReminderRule> _rules = initial;

    public IReadOnlyList<ReminderRule> Rules => Volatile.Read(ref _rules);

    /// <summary>Replaces the rule with the same id.</summary>
    /// <exception cref="KeyNotFoundException">No rule has that id.</exception>
    public void Replace(ReminderRule rule)
    {
        ArgumentNullException.ThrowIfNull(rule);
        var current = Rules;
        int index = current.ToList().FindIndex(r => r.Id == rule.Id);
        if (index < 0)
        {
            throw new KeyNotFoundException($"No reminder rule '{rule.Id}'.");
        }
        var next = current.ToArray();
        next[index] = rule;
        Volatile.Write(ref _rules, next);
    }
}
