namespace RunWatch.Reports.Rendering;

/// <summary>One chart of a report in both forms: SVG for the HTML page, PNG for the PDF.</summary>
/// <param name="Title">Chart title (plain text).</param>
/// <param name="Svg">SVG markup without an XML declaration, ready to inline.</param>
/// <param name="Png">PNG bytes of the same chart.</param>
/// <param name="WidthPx">Width in pixels.</param>
/// <param name="HeightPx">Height in pixels.</param>
public sealed record ReportChart(string Title, string Svg, byte[] Png, int WidthPx, int HeightPx);
