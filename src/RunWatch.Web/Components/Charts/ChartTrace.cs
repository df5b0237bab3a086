using RunWatch.Web.Charting;

namespace RunWatch.Web.Components.Charts;

/// <summary>One line or marker series of a time chart.</summary>
public sealed record ChartTrace(string Name, ChartSeries Series, string Color, bool Markers = false, string Dash = "solid");
