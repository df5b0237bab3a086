using RunWatch.Core.ControlCharts;

namespace RunWatch.Web.Components.Charts;

/// <summary>One run on a control chart: its value, whether it is in the baseline, and the run rules flagged at it.</summary>
public sealed record ControlChartPoint(string RunId, DateTimeOffset Date, double Value, bool Baseline, IReadOnlyList<RunRule> Rules);
