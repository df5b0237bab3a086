namespace RunWatch.Web.Data;

/// <summary>The QC verdict of a wafer and the reasons for it; <c>Rules</c> every rule judged (null when not recorded), <c>Agreement</c> the prediction's agreement, <c>Notes</c> what the evaluation said about its own inputs.</summary>
public sealed record VerdictView(VerdictOutcome Outcome, IReadOnlyList<string> Reasons, DateTimeOffset DecidedAt,
    IReadOnlyList<VerdictRuleView>? Rules = null, PredictionAgreement? Agreement = null);
