using System.Text.Json.Serialization;

namespace RunWatch.Core.Qc;

/// <summary>A wafer's QC verdict: the worst rule outcome, with every rule's result.</summary>
/// <param name="WaferId">Wafer judged.</param>
/// <param name="Recipe">Recipe whose specification was used.</param>
/// <param name="Outcome">Worst outcome over all rules (pass when every rule passed).</param>
/// <param name="Rules">Every evaluated rule, in the fixed rule order.</param>
public sealed record QcVerdict(string WaferId, string Recipe, QcOutcome Outcome, IReadOnlyList<QcRuleResult> Rules)
{
    /// <summary>The rules that did not pass: the verdict's reasons, worst first.</summary>
    [JsonIgnore]
    public IReadOnlyList<QcRuleResult> Reasons =>
        Rules.Where(r => r.Outcome != QcOutcome.Pass).OrderByDescending(r => r.Outcome).ToArray();
}
