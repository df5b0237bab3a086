namespace RunWatch.Web.Data;

/// <summary>One QC rule as judged for a wafer: what was measured, against which limits, the outcome and why.</summary>
public sealed record VerdictRuleView(string Rule, double? Measured, string Limit, string WarnLimit, string Unit, VerdictOutcome Outcome, string Reason);
