using System.Collections.Concurrent;
using Microsoft.Extensions.Options;
using RunWatch.Core.Safety;
using RunWatch.Web.Data;

namespace RunWatch.Web.Safety;

/// <summary>
/// Evaluates the reminder rules on a chamber's status and records in the audit log each time a reminder is shown
/// to a user: once per user for each stretch of time in which the reminder's condition holds. A stretch ends only
/// after the condition has stayed clear for <see cref="RearmAfter"/>, so a reading that hovers at a threshold (noise,
/// a flapping flag) does not log one "reminder shown" per crossing and flood the audit log.
/// </summary>
public sealed class ReminderMonitor(ReminderRuleSet rules, IDashboardCommands commands, DashboardClock clock, ReminderBindings bindings,
    IOptions<DashboardOptions> options)
{
    private readonly ConcurrentDictionary<(string Chamber, string Rule), long> _activation = new();
    private readonly ConcurrentDictionary<(string Chamber, string Rule), DateTimeOffset> _clearSince = new();
    private readonly ConcurrentDictionary<(string Chamber, string Rule, string User, long Activation), byte> _logged = new();
    private long _nextActivation;

    /// <summary>How long a reminder's condition must stay clear before its next showing is logged as a new one.</summary>
    public static readonly TimeSpan RearmAfter = TimeSpan.FromMinutes(10);

    /// <summary>The reminders that hold now for one chamber.</summary>
    public IReadOnlyList<ActiveReminder> Evaluate(ChamberStatus chamber) => Assess(chamber).Active;

    /// <summary>The reminders that hold now for one chamber, and those not watched on it (role without channel, or channel stale).</summary>
    public ReminderAssessment Assess(ChamberStatus chamber)
    {
        ArgumentNullException.ThrowIfNull(chamber);
        var state = StateOf(chamber);
        var assessment = ReminderEvaluator.Assess(rules.Rules, state);
        var active = assessment.Active;
        foreach (var rule in rules.Rules)
        {
            bool holds = active.Any(a => a.Rule.Id == rule.Id);
            var key = (chamber.Chamber, rule.Id);
            if (holds)
            {
                _clearSince.TryRemove(key, out _);
                _activation.GetOrAdd(key, _ => Interlocked.Increment(ref _nextActivation));
            }
            else if (_activation.ContainsKey(key))
            {
                DateTimeOffset since = _clearSince.GetOrAdd(key, clock.Now);
                if (clock.Now - since >= RearmAfter)
                {
                    _activation.TryRemove(key, out _);
                    _clearSince.TryRemove(key, out _);
                }
            }
        }
        return assessment;
    }

    /// <summary>The evaluator's input for a chamber: its latest values and the channel each role reads there.</summary>
    public LiveChamberState StateOf(ChamberStatus chamber)
    {
        ArgumentNullException.ThrowIfNull(chamber);
        return new LiveChamberState(chamber.Chamber, clock.Now, chamber.LastSampleAt, chamber.LatestValues,
            chamber.ActiveRun is not null, chamber.LastRunEndedAt, bindings.Effective(chamber), chamber.LatestTimes,
            options.Value.ReminderChannelStaleAfter);
    }

    /// <summary>Records that the reminders were shown to the user (once per activation).</summary>
    public async Task RecordShownAsync(IReadOnlyList<ActiveReminder> shown, string user, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(shown);
        foreach (var reminder in shown)
        {
            if (!_activation.TryGetValue((reminder.Chamber, reminder.Rule.Id), out long activation))
            {
                continue;
            }
            if (_logged.TryAdd((reminder.Chamber, reminder.Rule.Id, user, activation), 0))
            {
                await commands.RecordAuditAsync(
                    new AuditEntry(clock.Now, user, "reminder shown", reminder.Chamber + " / " + reminder.Rule.Id, reminder.Reason),
                    cancellationToken).ConfigureAwait(false);
            }
        }
    }

    /// <summary>Whether a reminder's showing to this user in its current activation is in the audit log.</summary>
    public bool IsLogged(ActiveReminder reminder, string user) =>
        _activation.TryGetValue((reminder.Chamber, reminder.Rule.Id), out long activation)
        && _logged.ContainsKey((reminder.Chamber, reminder.Rule.Id, user, activation));
}
