using RunWatch.Core.Safety;

namespace RunWatch.Web.Safety;

/// <summary>The reminder rules in force; admins may replace one (the caller records the audit entry). Thread-safe.</summary>
public sealed class ReminderRuleSet(IReadOnlyList<ReminderRule> initial)
{
    private IReadOnlyList<ReminderRule> _rules = initial;

    public IReadOnlyList<ReminderRule> Rules => Volatile.Read(ref _rules);

    /// <summary>The rules with configured thresholds in place of their defaults.</summary>
    /// <exception cref="ArgumentException">A threshold names an unknown rule, a rule without threshold, or is not finite.</exception>
    public static ReminderRuleSet WithThresholds(IReadOnlyList<ReminderRule> defaults, IReadOnlyDictionary<string, double> thresholds)
    {
        ArgumentNullException.ThrowIfNull(defaults);
        ArgumentNullException.ThrowIfNull(thresholds);
        var problems = Check(defaults, thresholds);
        if (problems.Count > 0)
        {
            throw new ArgumentException(string.Join(" ", problems), nameof(thresholds));
        }
        return new ReminderRuleSet([.. defaults.Select(r => thresholds.TryGetValue(r.Id, out double t) ? r with { Threshold = t } : r)]);
    }

    /// <summary>One message per configured threshold that cannot apply (empty when all can).</summary>
    public static IReadOnlyList<string> Check(IReadOnlyList<ReminderRule> defaults, IReadOnlyDictionary<string, double> thresholds)
    {
        ArgumentNullException.ThrowIfNull(defaults);
        ArgumentNullException.ThrowIfNull(thresholds);
        var problems = new List<string>();
        foreach (var (id, value) in thresholds)
        {
            ReminderRule? rule = defaults.FirstOrDefault(r => r.Id == id);
            if (rule is null)
            {
                problems.Add($"ReminderThresholds: no reminder rule '{id}'.");
            }
            else if (!ReminderRuleEditor.HasThreshold(rule))
            {
                problems.Add($"ReminderThresholds: the rule '{id}' has no threshold.");
            }
            else if (!double.IsFinite(value))
            {
                problems.Add($"ReminderThresholds: the threshold of '{id}' must be a finite number in {rule.Unit}.");
            }
        }
        return problems;
    }

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
