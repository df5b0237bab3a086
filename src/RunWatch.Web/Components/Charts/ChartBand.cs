namespace RunWatch.Web.Components.Charts;

/// <summary>A shaded rectangle: a time span (x) or a value band (y) with its label.</summary>
/// <param name="Label">Text drawn on the band (bands are never colour only).</param>
/// <param name="X0">Start time as a chart x string, or null for the whole width.</param>
/// <param name="X1">End time as a chart x string, or null.</param>
/// <param name="Y0">Lower value, or null for the whole height.</param>
/// <param name="Y1">Upper value, or null.</param>
/// <param name="Fill">Fill colour with alpha.</param>
/// <param name="LabelAtBottom">Draw the label at the band's foot, so a long band's label does not collide with the short bands over it.</param>
public sealed record ChartBand(string Label, string? X0, string? X1, double? Y0, double? Y1, string Fill, bool LabelAtBottom = false);
