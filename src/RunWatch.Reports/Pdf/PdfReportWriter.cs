using System.Globalization;
using RunWatch.Core.Model;
using RunWatch.Core.Qc;
using RunWatch.Core.Wafers;
using RunWatch.Reports.Html;
using RunWatch.Reports.Model;
using RunWatch.Reports.Rendering;
using SkiaSharp;
using static RunWatch.Reports.Rendering.ReportFormat;

namespace RunWatch.Reports.Pdf;

/// <summary>Writes a wafer report as an A4 PDF through SkiaSharp's SKDocument (text stays extractable).</summary>
public static partial class PdfReportWriter
{
    /// <summary>At most this many wire rows are printed; the CSV holds them all.</summary>
    public const int MaxWireRows = 60;

    private static readonly SKColor PassColour = new(0x2E, 0x7D, 0x32);
    private static readonly SKColor WarnColour = new(0xB2, 0x6A, 0x00);
    private static readonly SKColor FailColour = new(0xB0, 0x00, 0x20);

    /// <summary>Writes the PDF to <paramref name="output"/> (left open).</summary>
    public static void Write(WaferReport report, Stream output)
    {
        ArgumentNullException.ThrowIfNull(report);
        ArgumentNullException.ThrowIfNull(output);
        Write(report, ReportChartSet.Render(report), output);
    }

    /// <summary>The PDF as bytes.</summary>
    public static byte[] Write(WaferReport report)
    {
        using var stream = new MemoryStream();
        Write(report, stream);
        return stream.ToArray();
    }

    internal static void Write(WaferReport report, ReportChartSet charts, Stream output)
    {
        ReportFonts.EnsureLoaded();
        ReportIdentity id = report.Identity;
        var metadata = new SKDocumentPdfMetadata
        {
            Title = "Wafer report " + id.WaferId,
            Subject = "QC report of wafer " + id.WaferId + ", run " + id.RunId,
            Creator = "RunWatch " + id.SoftwareVersion,
            Producer = "RunWatch",
            Creation = id.GeneratedAt.UtcDateTime,
            Modified = id.GeneratedAt.UtcDateTime,
            RasterDpi = 150,
            // 101 asks Skia for lossless (Flate) images; the default re-encodes charts and thumbnails as lossy JPEG.
            EncodingQuality = 101,
        };
        using SKDocument document = SKDocument.CreatePdf(output, metadata) ?? throw new InvalidOperationException("SkiaSharp could not create a PDF document.");
        using (var page = new PdfLayout(document, "RunWatch wafer report · " + id.WaferId + " · run " + id.RunId + " · " + Time(id.GeneratedAt, id.TimeZoneId)))
        {
            page.Title("Wafer report " + id.WaferId, id.DataLabel);
            page.KeyValues([
                ("Run", id.RunId), ("Recipe", id.Recipe), ("Chamber", id.Chamber),
                ("Run start", Time(id.RunStart, id.TimeZoneId)), ("Run end", Time(id.RunEnd, id.TimeZoneId)), ("Report written", Time(id.GeneratedAt, id.TimeZoneId)),
            ]);
            page.Paragraph(ClockNote(id.TimeZoneId));
            if (report.Provenance is { } p)
            {
                page.KeyValues([("Revision", p.Revision.ToString(CultureInfo.InvariantCulture) + " · " + p.Reason + " · asked by " + p.Requester)]);
            }
            Verdict(page, report.Verdict);
            page.Heading("Prediction summary", keepWithNext: 40);
            page.KeyValues([.. HtmlReportWriter.PredictionSummaryRows(report)]);
            Thermal(page, report.Thermal, charts.Thermal);
            Fields(page, report.Fields);
            Statistics(page, report.Statistics, charts.Histogram);
            if (DropletWording.Wafer(report.Droplets) is { Length: > 0 } droplets)
            {
                page.Paragraph(droplets);
            }
            ModelSection(page, report, charts.RadiusVersusArea);
            Prediction(page, report, charts.PredictedVersusMeasured);
            Wires(page, report);
            if (report.Provenance is { } record)
            {
                Record(page, record, id.SoftwareVersion);
            }
            if (id.Notes.Count > 0)
            {
                page.Heading("Notes");
                foreach (string note in id.Notes)
                {
                    page.Paragraph("• " + note);
                }
            }
            page.Heading("Caution");
            page.Paragraph(ReportWording.Caution);
        }
        document.Close();
    }

    private static SKColor Colour(QcOutcome outcome) => outcome switch
    {
        QcOutcome.Pass => PassColour,
        QcOutcome.Warn => WarnColour,
        _ => FailColour,
    };

    private static void Verdict(PdfLayout page, QcVerdict verdict)
    {
        page.Heading("Verdict: " + HtmlReportWriter.VerdictWord(verdict.Outcome), Colour(verdict.Outcome));
        page.Paragraph($"Specification of recipe {verdict.Recipe}: {verdict.Rules.Count} rules checked.");
        if (verdict.Reasons.Count > 0)
        {
            page.SubHeading("Reasons");
            foreach (QcRuleResult r in verdict.Reasons)
            {
                using var paint = new SKPaint { Color = Colour(r.Outcome), IsAntialias = true };
                page.Paragraph(HtmlReportWriter.VerdictWord(r.Outcome) + ": " + r.Reason, paint);
            }
        }
        var rows = new List<string[]>();
        var colours = new List<SKColor?>();
        foreach (QcRuleResult r in verdict.Rules)
        {
            rows.Add([r.Description, Measured(r.Measured, r.Unit), r.Limit, r.WarnLimit, HtmlReportWriter.VerdictWord(r.Outcome)]);
            colours.Add(r.Outcome == QcOutcome.Pass ? null : Colour(r.Outcome));
        }
        page.Table(["Rule", "Measured", "Limit", "Warn limit", "Outcome"], rows, [0.37f, 0.16f, 0.2f, 0.17f, 0.10f], colours);
    }

    private static void Thermal(PdfLayout page, ThermalSummary t, ReportChart chart)
    {
        page.Heading("Thermal history", keepWithNext: page.ImageHeight(chart.Png, page.ContentWidth, caption: false));
        page.Image(chart.Png, page.ContentWidth);
        page.KeyValues([
            ("Growth window", Minutes(t.GrowthWindowStartS) + " to " + Minutes(t.GrowthWindowEndS)),
            ("Setpoint", Number(t.SetpointC, "0.#") + " °C"),
            ("T_eff", Number(t.EffectiveTemperatureC, "0.##") + " °C"),
            ("L_nom / L_eff", Number(t.NominalLengthNm, "0.#") + " nm / " + Number(t.EffectiveLengthNm, "0.#") + " nm (ratio " + Number(t.EffectiveLengthNm / t.NominalLengthNm, "0.000") + ")"),
            ("Convention factor c", Number(t.ConventionFactor, "0.##") + "  (L² = c·∫D dt)"),
            ("Record coverage", Percent(t.CoverageFraction)),
            ("Gap policy", t.GapPolicy),
        ]);
        page.SubHeading("Excursions");
        if (t.Excursions.Count == 0)
        {
            page.Paragraph("No excursions in the record.");
            return;
        }
        var rows = new List<string[]>();
        for (int i = 0; i < t.Excursions.Count; i++)
        {
            ExcursionRow e = t.Excursions[i];
            rows.Add([(i + 1).ToString(CultureInfo.InvariantCulture), Minutes(e.StartS), Minutes(e.EndS), Number(e.PeakTemperatureC, "0.#"), Number(e.PeakDeviationK, "+0.#;−0.#"), Percent(e.RelativeLChange), e.Description]);
        }
        page.Table(["#", "Start", "End", "Peak (°C)", "Dev. (K)", "ΔL/L", "Description"], rows, [0.05f, 0.12f, 0.12f, 0.12f, 0.11f, 0.11f, 0.37f]);
    }

    private static void Fields(PdfLayout page, IReadOnlyList<FieldThumbnail> fields)
    {
        page.Heading("SEM fields", keepWithNext: 170);
        if (fields.Count == 0)
        {
            page.Paragraph("No fields.");
            return;
        }
        const int PerRow = 3;
        float gap = 10;
        float width = (page.ContentWidth - ((PerRow - 1) * gap)) / PerRow;
        for (int start = 0; start < fields.Count; start += PerRow)
        {
            float rowHeight = 0;
            for (int i = start; i < Math.Min(start + PerRow, fields.Count); i++)
            {
                rowHeight = Math.Max(rowHeight, ReportChartSet.IsPng(fields[i].Png.Span) ? page.ImageHeight(fields[i].Png.Span, width, caption: true) : 12);
            }
            page.Ensure(rowHeight + 6);
            for (int i = start; i < Math.Min(start + PerRow, fields.Count); i++)
            {
                FieldThumbnail f = fields[i];
                float x = PdfLayout.Margin + ((i - start) * (width + gap));
                string caption = f.FieldName + " · " + f.WireCount + " wires" + DropletWording.FieldCount(f.Droplets);
                if (!ReportChartSet.IsPng(f.Png.Span) || !page.Image(f.Png.Span, width, caption, x, advance: false))
                {
                    // Drawn as a note in place of the image so a bad thumbnail never stops the report.
                    page.Paragraph(f.FieldName + ": thumbnail is not a PNG image; left out");
                }
            }
            page.Advance(rowHeight + 6);
        }
    }

    private static void Statistics(PdfLayout page, WireStatistics s, ReportChart histogram)
    {
        page.Heading("Wire statistics", keepWithNext: 70);
        page.KeyValues([
            ("Wires", s.Count.ToString(CultureInfo.InvariantCulture)),
            ("Mean radius ± SD", Number(s.MeanRadiusNm, "0.0") + " ± " + Number(s.RadiusSdNm, "0.0") + " nm (CV " + Number(s.RadiusCv, "0.000") + ")"),
            ("Median, range", Number(s.MedianRadiusNm, "0.0") + " nm, " + Number(s.MinRadiusNm, "0.0") + " to " + Number(s.MaxRadiusNm, "0.0") + " nm"),
            ("Density", Scientific(s.DensityPerCm2) + " cm⁻²"),
            ("Vertical yield", Percent(s.VerticalYield)),
        ]);
        page.Image(histogram.Png, page.ContentWidth * 0.8f);
    }

    private static void ModelSection(PdfLayout page, WaferReport report, ReportChart chart)
    {
        page.Heading("Radius model", keepWithNext: page.ImageHeight(chart.Png, page.ContentWidth * 0.8f, caption: false));
        page.Image(chart.Png, page.ContentWidth * 0.8f);
        if (report.Diffusion is { } diffusion)
        {
            DiffusionModel(page, diffusion);
            return;
        }
        if (report.Model is not { } m)
        {
            page.Paragraph("No accepted radius model for this process yet.");
            return;
        }
        page.Paragraph((m.Kind == RadiusModelKind.Linear ? "Linear model: " : "Power-law model: ") + m.Formula());
        var rows = new List<string[]>();
        foreach (ParameterEstimate p in m.Parameters)
        {
            rows.Add([p.Name, Number(p.Value, ParameterFormat(p.Unit)), Number(p.StandardError, ParameterFormat(p.Unit)), Number(p.Lower95, ParameterFormat(p.Unit)) + " to " + Number(p.Upper95, ParameterFormat(p.Unit)), p.Unit]);
        }
        page.Table(["Parameter", "Estimate", "SE", "95 % interval", "Unit"], rows, [0.16f, 0.2f, 0.2f, 0.32f, 0.12f]);
        page.KeyValues([
            ("Fit", m.Count + " wires, r² " + Number(m.RSquared, "0.0000") + ", adjusted r² " + Number(m.AdjustedRSquared, "0.0000") + ", RMSE " + Number(m.RmseNm, "0.0") + " nm, AIC " + Number(m.Aic, "0.0")),
        ]);
    }

    private static void Prediction(PdfLayout page, WaferReport report, ReportChart? chart)
    {
        page.Heading("Prediction", keepWithNext: 90);
        if (report.Prediction is { } p)
        {
            page.SubHeading("Before SEM");
            page.KeyValues([
                ("Expected mean radius", Number(p.MeanRadiusNm, "0.0") + " nm, wire-to-wire SD " + Number(p.RadiusSdNm, "0.0") + " nm"),
                ("5 % to 95 %", Number(p.P05Nm, "0.0") + " to " + Number(p.P95Nm, "0.0") + " nm"),
                ("Simulated", p.Fields + " fields, " + p.WireCount + " wires, seed " + p.Seed + "; L_eff " + Number(p.CaptureRadiusNm, "0") + " nm, density " + Scientific(p.DensityPerCm2) + " cm⁻²"),
                ("Note", p.Note),
            ]);
        }
        else
        {
            page.Paragraph("No prediction was made before SEM.");
        }
        if (report.Comparison is { } c)
        {
            page.SubHeading("After SEM");
            page.KeyValues([
                ("Agreement", c.Count + " wires, r² " + Number(c.RSquared, "0.000") + ", RMSE " + Number(c.RmseNm, "0.0") + " nm"),
                ("Bias (predicted − measured)", Number(c.BiasNm, "+0.0;−0.0") + " nm, mean |error| " + Number(c.MeanAbsoluteErrorNm, "0.0") + " nm"),
            ]);
        }
        if (chart is not null)
        {
            page.Image(chart.Png, page.ContentWidth * 0.8f);
        }
    }

    private static void Record(PdfLayout page, ReportProvenance p, string softwareVersion)
    {
        page.Heading("Record");
        page.Paragraph("This report is revision " + p.Revision.ToString(CultureInfo.InvariantCulture)
            + " of this wafer's report; earlier revisions are kept unchanged. The SHA-256 of its files is listed in content.sha256 beside it; runwatch verify checks them. Hashes are printed in groups of 16 hex digits.");
        page.KeyValues([
            ("Reason", p.Reason), ("Asked by", p.Requester), ("RunWatch", softwareVersion),
            ("Configuration (SHA-256)", Grouped(p.ConfigSha256)), ("Radius model", p.ModelId),
        ]);
        var rows = new List<string[]>();
        foreach (ReportInputFile input in p.Inputs)
        {
            rows.Add([input.Name, Grouped(input.Sha256)]);
        }
        page.Table(["Input image", "SHA-256"], rows, [0.28f, 0.72f]);
    }

    /// <summary>A hex hash in groups of 16 digits, so a line can wrap between groups instead of cutting the hash.</summary>
    private static string Grouped(string hex)
    {
        var parts = new List<string>();
        for (int i = 0; i < hex.Length; i += 16)
        {
            parts.Add(hex.Substring(i, Math.Min(16, hex.Length - i)));
        }
        return string.Join(' ', parts);
    }

    private static void Wires(PdfLayout page, WaferReport report)
    {
        page.Heading("Wires");
        int shown = Math.Min(report.Wires.Count, MaxWireRows);
        if (shown < report.Wires.Count)
        {
            page.Paragraph($"First {shown} of {report.Wires.Count} wires; the CSV file holds every wire.");
        }
        var rows = new List<string[]>(shown);
        for (int i = 0; i < shown; i++)
        {
            WireRow w = report.Wires[i];
            rows.Add([w.FieldName, w.WireId.ToString(CultureInfo.InvariantCulture), Number(w.XNm, "0"), Number(w.YNm, "0"), Number(w.RadiusNm, "0.0"), Number(w.NormalisedArea, "0.000"), Number(w.PredictedRadiusNm, "0.0"), w.Vertical ? "yes" : "no"]);
        }
        page.Table(["Field", "Wire", "x (nm)", "y (nm)", "r (nm)", "Â", "Pred. r (nm)", "Vertical"], rows, [0.26f, 0.08f, 0.11f, 0.11f, 0.1f, 0.1f, 0.14f, 0.1f]);
    }
}
