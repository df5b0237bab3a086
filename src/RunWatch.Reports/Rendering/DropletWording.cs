using System.Globalization;
using RunWatch.Core.Wafers;

namespace RunWatch.Reports.Rendering;

/// <summary>The report's wording for wire (facet) and droplet radius side by side, the same in HTML and PDF.</summary>
internal static class DropletWording
{
    /// <summary>One sentence for the wafer (every field pooled); empty when no wire carries a droplet.</summary>
    public static string Wafer(DropletFigures? d) => d is { WithDroplet: > 0 } ? "Wires with a droplet: " + Figures(d) : "";

    /// <summary>A caption suffix for one field (" · …"); empty when no wire of the field carries a droplet.</summary>
    public static string FieldSuffix(DropletFigures? d) => d is { WithDroplet: > 0 } ? " · with droplet: " + Figures(d) : "";

    /// <summary>A short caption suffix for a narrow thumbnail (" · n with droplet").</summary>
    public static string FieldCount(DropletFigures? d) => d is { WithDroplet: > 0 } ? string.Create(CultureInfo.InvariantCulture, $" · {d.WithDroplet} with droplet") : "";

    private static string Figures(DropletFigures d)
    {
        string text = d.WithDroplet.ToString(CultureInfo.InvariantCulture);
        if (d.WithBoth > 0)
        {
            text += string.Create(CultureInfo.InvariantCulture, $"; mean wire radius {ReportFormat.Number(d.MeanWireRadiusNm, "0.0")} nm, mean droplet radius {ReportFormat.Number(d.MeanDropletRadiusNm, "0.0")} nm (same {d.WithBoth} wires)");
        }
        int dropletOnly = d.WithDroplet - d.WithBoth;
        if (dropletOnly > 0)
        {
            text += string.Create(CultureInfo.InvariantCulture, $"; {dropletOnly} show only their droplet (mean {ReportFormat.Number(d.MeanDropletOnlyRadiusNm, "0.0")} nm) and have no wire radius: the process has no droplet contact angle set");
        }
        return text + ".";
    }
}
