namespace RunWatch.Core.Qc;

/// <summary>The result of one QC rule: what was measured, against what, and the outcome.</summary>
/// <param name="Rule">Stable rule id (for example "mean-radius").</param>
/// <param name="Description">What the rule checks, in plain words.</param>
/// <param name="Measured">Measured value, or null when it was not measured.</param>
/// <param name="Limit">The fail limit as text (for example "≤ 0.25", "60 ± 10", "1e8 … 5e8").</param>
/// <param name="WarnLimit">The warn limit as text, or empty when the rule has no warn band.</param>
/// <param name="Unit">Unit of <paramref name="Measured"/> and the limits ("nm", "", "cm⁻²"...).</param>
/// <param name="Outcome">Pass, warn or fail.</param>
/// <param name="Reason">One sentence explaining the outcome.</param>
public sealed record QcRuleResult(string Rule, string Description, double? Measured, string Limit, string WarnLimit, string Unit, QcOutcome Outcome, string Reason);
