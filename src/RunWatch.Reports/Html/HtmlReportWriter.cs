using System.Net;
using System.Text;
using RunWatch.Core.Model;
using RunWatch.Core.Qc;
using RunWatch.Core.Wafers;
using RunWatch.Reports.Model;
using RunWatch.Reports.Rendering;
using static RunWatch.Reports.Rendering.ReportFormat;

namespace RunWatch.Reports.Html;

/// <summary>
/// Writes a wafer report as one self-contained, printable XHTML-style page: inline SVG charts, thumbnails as data:
/// URIs, no external resources. Every string from outside is HTML-encoded.
/// </summary>
public static partial class HtmlReportWriter
{
    /// <summary>At most this many wire rows appear on the page; the CSV holds them all.</summary>
    public const int MaxWireRows = 200;

    /// <summary>Formats the page.</summary>
    public static string Write(WaferReport report)
    {
        ArgumentNullException.ThrowIfNull(report);
        return Write(report, ReportChartSet.Render(report));
    }

    internal static string Write(WaferReport report, ReportChartSet charts)
    {
        var h = new StringBuilder(256 * 1024);
        ReportIdentity id = report.Identity;
        h.Append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\" />\n");
        h.Append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\" />\n");
        h.Append("<title>Wafer report ").Append(E(id.WaferId)).Append("</title>\n");
        h.Append("<style>\n").Append(HtmlStyles.Css).Append("</style>\n</head>\n<body>\n");

        h.Append("<header>\n<h1>Wafer report <span class=\"id\">").Append(E(id.WaferId)).Append("</span></h1>\n");
        if (id.DataLabel.Length > 0)
        {
            h.Append("<p class=\"label\">").Append(E(id.DataLabel)).Append("</p>\n");
        }
        KeyValues(h, [
            ("Run", E(id.RunId)), ("Recipe", E(id.Recipe)), ("Chamber", E(id.Chamber)),
            ("Run start", Time(id.RunStart, id.TimeZoneId)), ("Run end", Time(id.RunEnd, id.TimeZoneId)),
            ("Report written", Time(id.GeneratedAt, id.TimeZoneId)), ("RunWatch", E(id.SoftwareVersion)),
        ]);
        h.Append("<p class=\"clock\">").Append(E(ClockNote(id.TimeZoneId))).Append("</p>\n");
        if (report.Provenance is { } p)
        {
            KeyValues(h, [("Revision", p.Revision.ToString(System.Globalization.CultureInfo.InvariantCulture) + " · " + E(p.Reason) + " · asked by " + E(p.Requester))]);
        }
        h.Append("</header>\n");

        Verdict(h, report.Verdict);
        PredictionSummary(h, report);
        Thermal(h, report.Thermal, charts.Thermal);
        Fields(h, report.Fields);
        Wires(h, report, charts.Histogram);
        ModelSection(h, report, charts.RadiusVersusArea);
        PredictionSection(h, report, charts.PredictedVersusMeasured);
        WireTable(h, report);

        if (report.Provenance is { } record)
        {
            Record(h, record, id.SoftwareVersion);
        }
        if (id.Notes.Count > 0)
        {
            h.Append("<section>\n<h2>Notes</h2>\n<ul>\n");
            foreach (string note in id.Notes)
            {
                h.Append("<li>").Append(E(note)).Append("</li>\n");
            }
            h.Append("</ul>\n</section>\n");
        }
        h.Append("<footer class=\"caution\">\n<p><strong>Caution.</strong> ").Append(E(ReportWording.Caution)).Append("</p>\n</footer>\n");
        h.Append("</body>\n</html>\n");
        return h.ToString();
    }

    private static void Verdict(StringBuilder h, QcVerdict verdict)
    {
        string cls = verdict.Outcome.ToString().ToLowerInvariant();
        h.Append("<section class=\"verdict ").Append(cls).Append("\">\n<h2>Verdict: <span class=\"outcome\">").Append(VerdictWord(verdict.Outcome)).Append("</span></h2>\n");
        h.Append("<p>Specification of recipe ").Append(E(verdict.Recipe)).Append(": ").Append(verdict.Rules.Count).Append(" rules checked.</p>\n");
        if (verdict.Reasons.Count > 0)
        {
            h.Append("<h3>Reasons</h3>\n<ul class=\"reasons\">\n");
            foreach (QcRuleResult r in verdict.Reasons)
            {
                h.Append("<li><span class=\"tag ").Append(r.Outcome.ToString().ToLowerInvariant()).Append("\">").Append(VerdictWord(r.Outcome)).Append("</span> ")
                    .Append(E(r.Reason)).Append("</li>\n");
            }
            h.Append("</ul>\n");
        }
        h.Append("<table class=\"rules\">\n<thead><tr><th>Rule</th><th>Measured</th><th>Limit</th><th>Warn limit</th><th>Unit</th><th>Outcome</th></tr></thead>\n<tbody>\n");
        foreach (QcRuleResult r in verdict.Rules)
        {
            h.Append("<tr><td>").Append(E(r.Description)).Append("</td><td class=\"num\">").Append(E(Measured(r.Measured, ""))).Append("</td><td>")
                .Append(E(r.Limit)).Append("</td><td>").Append(E(r.WarnLimit)).Append("</td><td>").Append(E(r.Unit)).Append("</td><td class=\"")
                .Append(r.Outcome.ToString().ToLowerInvariant()).Append("\">").Append(VerdictWord(r.Outcome)).Append("</td></tr>\n");
        }
        h.Append("</tbody>\n</table>\n</section>\n");
    }

    private static void Thermal(StringBuilder h, ThermalSummary t, ReportChart chart)
    {
        h.Append("<section>\n<h2>Thermal history</h2>\n");
        Figure(h, chart);
        KeyValues(h, [
            ("Growth window", Minutes(t.GrowthWindowStartS) + " to " + Minutes(t.GrowthWindowEndS)),
            ("Setpoint", Number(t.SetpointC, "0.#") + " °C"),
            ("T_eff", Number(t.EffectiveTemperatureC, "0.##") + " °C"),
            ("L_nom", Number(t.NominalLengthNm, "0.#") + " nm"),
            ("L_eff", Number(t.EffectiveLengthNm, "0.#") + " nm"),
            ("L_eff / L_nom", Number(t.EffectiveLengthNm / t.NominalLengthNm, "0.000")),
            ("Convention factor c", Number(t.ConventionFactor, "0.##") + "  (L² = c·∫D dt)"),
            ("Record coverage", Percent(t.CoverageFraction)),
            ("Gap policy", E(t.GapPolicy)),
        ]);
        h.Append("<h3>Excursions</h3>\n");
        if (t.Excursions.Count == 0)
        {
            h.Append("<p>No excursions in the record.</p>\n");
        }
        else
        {
            h.Append("<table>\n<thead><tr><th>#</th><th>Start</th><th>End</th><th>Peak (°C)</th><th>Peak deviation (K)</th><th>ΔL/L</th><th>Description</th></tr></thead>\n<tbody>\n");
            for (int i = 0; i < t.Excursions.Count; i++)
            {
                ExcursionRow e = t.Excursions[i];
                h.Append("<tr><td>").Append(i + 1).Append("</td><td>").Append(Minutes(e.StartS)).Append("</td><td>").Append(Minutes(e.EndS))
                    .Append("</td><td class=\"num\">").Append(Number(e.PeakTemperatureC, "0.#")).Append("</td><td class=\"num\">").Append(Number(e.PeakDeviationK, "+0.#;−0.#"))
                    .Append("</td><td class=\"num\">").Append(Percent(e.RelativeLChange)).Append("</td><td>").Append(E(e.Description)).Append("</td></tr>\n");
            }
            h.Append("</tbody>\n</table>\n");
        }
        h.Append("</section>\n");
    }

    private static void Fields(StringBuilder h, IReadOnlyList<FieldThumbnail> fields)
    {
        h.Append("<section>\n<h2>SEM fields</h2>\n");
        if (fields.Count == 0)
        {
            h.Append("<p>No fields.</p>\n");
        }
        h.Append("<div class=\"fields\">\n");
        foreach (FieldThumbnail f in fields)
        {
            h.Append("<figure class=\"field\">");
            if (ReportChartSet.IsPng(f.Png.Span))
            {
                h.Append("<img alt=\"").Append(E(f.FieldName)).Append("\" src=\"data:image/png;base64,").Append(Convert.ToBase64String(f.Png.Span)).Append("\" />");
            }
            else
            {
                h.Append("<p class=\"missing\">thumbnail is not a PNG image; left out</p>");
            }
            h.Append("<figcaption>").Append(E(f.FieldName)).Append(" · ").Append(f.WireCount).Append(" wires").Append(E(DropletWording.FieldSuffix(f.Droplets)));
            if (f.Caption.Length > 0)
            {
                h.Append("<br />").Append(E(f.Caption));
            }
            h.Append("</figcaption></figure>\n");
        }
        h.Append("</div>\n</section>\n");
    }

    private static void Wires(StringBuilder h, WaferReport report, ReportChart histogram)
    {
        WireStatistics s = report.Statistics;
        h.Append("<section>\n<h2>Wire statistics</h2>\n");
        KeyValues(h, [
            ("Wires", s.Count.ToString(System.Globalization.CultureInfo.InvariantCulture)),
            ("Mean radius", Number(s.MeanRadiusNm, "0.0") + " nm"),
            ("SD", Number(s.RadiusSdNm, "0.0") + " nm"),
            ("CV", Number(s.RadiusCv, "0.000")),
            ("Median", Number(s.MedianRadiusNm, "0.0") + " nm"),
            ("Range", Number(s.MinRadiusNm, "0.0") + " to " + Number(s.MaxRadiusNm, "0.0") + " nm"),
            ("Density", Scientific(s.DensityPerCm2) + " cm⁻²"),
            ("Vertical yield", Percent(s.VerticalYield)),
        ]);
        if (DropletWording.Wafer(report.Droplets) is { Length: > 0 } droplets)
        {
            h.Append("<p>").Append(E(droplets)).Append("</p>\n");
        }
        Figure(h, histogram);
        h.Append("</section>\n");
    }

    private static void ModelSection(StringBuilder h, WaferReport report, ReportChart chart)
    {
        h.Append("<section>\n<h2>Radius model</h2>\n");
        Figure(h, chart);
        if (report.Diffusion is { } diffusion)
        {
            DiffusionModel(h, diffusion);
            return;
        }
        if (report.Model is not { } m)
        {
            h.Append("<p>No accepted radius model for this process yet.</p>\n</section>\n");
            return;
        }
        h.Append("<p>").Append(E(m.Kind == RadiusModelKind.Linear ? "Linear model" : "Power-law model")).Append(": ").Append(E(m.Formula())).Append("</p>\n");
        ParameterTable(h, m.Parameters);
        KeyValues(h, [
            ("Wires in fit", m.Count.ToString(System.Globalization.CultureInfo.InvariantCulture)),
            ("r²", Number(m.RSquared, "0.0000")), ("Adjusted r²", Number(m.AdjustedRSquared, "0.0000")),
            ("RMSE", Number(m.RmseNm, "0.00") + " nm"), ("AIC", Number(m.Aic, "0.0")),
        ]);
        h.Append("</section>\n");
    }

    private static void PredictionSection(StringBuilder h, WaferReport report, ReportChart? chart)
    {
        h.Append("<section>\n<h2>Prediction</h2>\n");
        if (report.Prediction is { } p)
        {
            h.Append("<h3>Before SEM</h3>\n");
            KeyValues(h, [
                ("Expected mean radius", Number(p.MeanRadiusNm, "0.0") + " nm"),
                ("Wire-to-wire SD", Number(p.RadiusSdNm, "0.0") + " nm (CV " + Number(p.RadiusCv, "0.000") + ")"),
                ("5 % to 95 %", Number(p.P05Nm, "0.0") + " to " + Number(p.P95Nm, "0.0") + " nm"),
                ("Field-to-field SD of the mean", Number(p.FieldMeanSdNm, "0.00") + " nm"),
                ("Simulated", p.Fields + " fields, " + p.WireCount + " wires, seed " + p.Seed),
                ("Inputs", "L_eff " + Number(p.CaptureRadiusNm, "0") + " nm, density " + Scientific(p.DensityPerCm2) + " cm⁻²"),
                ("Note", E(p.Note)),
            ]);
        }
        else
        {
            h.Append("<p>No prediction was made before SEM.</p>\n");
        }
        if (report.Comparison is { } c)
        {
            h.Append("<h3>After SEM</h3>\n");
            KeyValues(h, [
                ("Wires compared", c.Count.ToString(System.Globalization.CultureInfo.InvariantCulture)),
                ("r²", Number(c.RSquared, "0.000")), ("RMSE", Number(c.RmseNm, "0.00") + " nm"),
                ("Bias (predicted − measured)", Number(c.BiasNm, "+0.00;−0.00") + " nm"), ("Mean |error|", Number(c.MeanAbsoluteErrorNm, "0.00") + " nm"),
            ]);
        }
        if (chart is not null)
        {
            Figure(h, chart);
        }
        h.Append("</section>\n");
    }

    private static void WireTable(StringBuilder h, WaferReport report)
    {
        h.Append("<section class=\"wires\">\n<h2>Wires</h2>\n");
        int shown = Math.Min(report.Wires.Count, MaxWireRows);
        if (shown < report.Wires.Count)
        {
            h.Append("<p>First ").Append(shown).Append(" of ").Append(report.Wires.Count).Append(" wires; the CSV file holds every wire.</p>\n");
        }
        h.Append("<table>\n<thead><tr><th>Field</th><th>Wire</th><th>x (nm)</th><th>y (nm)</th><th>r (nm)</th><th>Â</th><th>Predicted r (nm)</th><th>Vertical</th></tr></thead>\n<tbody>\n");
        for (int i = 0; i < shown; i++)
        {
            WireRow w = report.Wires[i];
            h.Append("<tr><td>").Append(E(w.FieldName)).Append("</td><td class=\"num\">").Append(w.WireId).Append("</td><td class=\"num\">").Append(Number(w.XNm, "0"))
                .Append("</td><td class=\"num\">").Append(Number(w.YNm, "0")).Append("</td><td class=\"num\">").Append(Number(w.RadiusNm, "0.0"))
                .Append("</td><td class=\"num\">").Append(Number(w.NormalisedArea, "0.000")).Append("</td><td class=\"num\">").Append(Number(w.PredictedRadiusNm, "0.0"))
                .Append("</td><td>").Append(w.Vertical ? "yes" : "no").Append("</td></tr>\n");
        }
        h.Append("</tbody>\n</table>\n</section>\n");
    }

    private static void ParameterTable(StringBuilder h, IReadOnlyList<ParameterEstimate> parameters)
    {
        h.Append("<table>\n<thead><tr><th>Parameter</th><th>Estimate</th><th>SE</th><th>95 % interval</th><th>Unit</th></tr></thead>\n<tbody>\n");
        foreach (ParameterEstimate p in parameters)
        {
            string f = ParameterFormat(p.Unit);
            h.Append("<tr><td>").Append(E(p.Name)).Append("</td><td class=\"num\">").Append(Number(p.Value, f)).Append("</td><td class=\"num\">")
                .Append(Number(p.StandardError, f)).Append("</td><td class=\"num\">").Append(Number(p.Lower95, f)).Append(" to ")
                .Append(Number(p.Upper95, f)).Append("</td><td>").Append(E(p.Unit)).Append("</td></tr>\n");
        }
        h.Append("</tbody>\n</table>\n");
    }

    /// <summary>The prediction in brief, on the first page beside the verdict; the full section follows later.</summary>
    private static void PredictionSummary(StringBuilder h, WaferReport report)
    {
        h.Append("<section class=\"prediction-summary\">\n<h2>Prediction summary</h2>\n");
        KeyValues(h, [.. PredictionSummaryRows(report)]);
        h.Append("</section>\n");
    }

    /// <summary>Rows shared by the HTML and PDF first pages (plain text; the HTML encodes nothing here that came from outside).</summary>
    internal static IEnumerable<(string Key, string Value)> PredictionSummaryRows(WaferReport report)
    {
        yield return ("Measured mean radius", Number(report.Statistics.MeanRadiusNm, "0.0") + " nm (" + report.Statistics.Count + " wires)");
        yield return report.Prediction is { } p
            ? ("Predicted before SEM", Number(p.MeanRadiusNm, "0.0") + " nm, 5–95 % " + Number(p.P05Nm, "0.0") + " to " + Number(p.P95Nm, "0.0") + " nm")
            : ("Predicted before SEM", "no prediction (no accepted radius model yet)");
        yield return report.Comparison is { } c
            ? ("Predicted against measured", "bias " + Number(c.BiasNm, "+0.0;−0.0") + " nm, RMSE " + Number(c.RmseNm, "0.0") + " nm, r² " + Number(c.RSquared, "0.000") + " over " + c.Count + " wires")
            : ("Predicted against measured", "not compared (no accepted radius model yet)");
    }

    private static void Record(StringBuilder h, ReportProvenance p, string softwareVersion)
    {
        h.Append("<section class=\"record\">\n<h2>Record</h2>\n<p>This report is revision ").Append(p.Revision)
            .Append(" of this wafer's report; earlier revisions are kept unchanged. The SHA-256 of its files is listed in content.sha256 beside it; <code>runwatch verify</code> checks them.</p>\n");
        KeyValues(h, [
            ("Reason", E(p.Reason)), ("Asked by", E(p.Requester)), ("RunWatch", E(softwareVersion)),
            ("Configuration and specification (SHA-256)", "<code>" + E(p.ConfigSha256) + "</code>"), ("Radius model", E(p.ModelId)),
        ]);
        h.Append("<table>\n<thead><tr><th>Input image</th><th>SHA-256</th></tr></thead>\n<tbody>\n");
        foreach (ReportInputFile input in p.Inputs)
        {
            h.Append("<tr><td>").Append(E(input.Name)).Append("</td><td><code>").Append(E(input.Sha256)).Append("</code></td></tr>\n");
        }
        h.Append("</tbody>\n</table>\n</section>\n");
    }

    private static void KeyValues(StringBuilder h, (string Key, string EncodedValue)[] rows)
    {
        h.Append("<table class=\"kv\">\n<tbody>\n");
        foreach ((string key, string value) in rows)
        {
            h.Append("<tr><th>").Append(E(key)).Append("</th><td>").Append(value).Append("</td></tr>\n");
        }
        h.Append("</tbody>\n</table>\n");
    }

    private static void Figure(StringBuilder h, ReportChart chart)
    {
        h.Append("<figure class=\"chart\" aria-label=\"").Append(E(chart.Title)).Append("\">\n").Append(chart.Svg).Append("\n</figure>\n");
    }

    internal static string VerdictWord(QcOutcome outcome) => outcome switch
    {
        QcOutcome.Pass => "PASS",
        QcOutcome.Warn => "WARN",
        _ => "FAIL",
    };

    private static string E(string? text) => WebUtility.HtmlEncode(text ?? "");
}
