namespace RunWatch.Core.ControlCharts;

/// <summary>A run rule that fires at a point: the index of the last point of the pattern and the rule.</summary>
/// <param name="Index">Index of the point that completes the pattern.</param>
/// <param name="Rule">The rule.</param>
public readonly record struct RunRuleSignal(int Index, RunRule Rule);
