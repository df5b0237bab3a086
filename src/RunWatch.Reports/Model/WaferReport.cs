using RunWatch.Core.Model;
using RunWatch.Core.Model.Prediction;
using RunWatch.Core.Qc;
using RunWatch.Core.Wafers;

namespace RunWatch.Reports.Model;

/// <summary>Everything a wafer report shows. The writers only format it; they compute nothing that changes a verdict.</summary>
/// <param name="Identity">Run and wafer identity.</param>
/// <param name="Thermal">Thermal history, growth window, excursions and diffusion lengths.</param>
/// <param name="Fields">Field thumbnails with overlays.</param>
/// <param name="Wires">Every measured wire.</param>
/// <param name="Statistics">Wire statistics.</param>
/// <param name="Model">The process's accepted radius model, or null when none is accepted yet.</param>
/// <param name="CaptureRadiusNm">Capture radius L used for Â (nm).</param>
/// <param name="Prediction">Prediction made before SEM, or null.</param>
/// <param name="Comparison">Predicted against measured after SEM, or null.</param>
/// <param name="Verdict">The QC verdict with its rules.</param>
/// <param name="Diffusion">The diffusion radius model the wafer was judged with, or null when it was not applied.</param>
/// <param name="Droplets">Wire and droplet radius of the wires carrying a droplet, every field pooled; null when not reported.</param>
public sealed record WaferReport(
    ReportIdentity Identity,
    ThermalSummary Thermal,
    IReadOnlyList<FieldThumbnail> Fields,
    IReadOnlyList<WireRow> Wires,
    WireStatistics Statistics,
    RadiusModelFit? Model,
    double CaptureRadiusNm,
    RadiusPrediction? Prediction,
    PredictedVsMeasured? Comparison,
    QcVerdict Verdict,
    DiffusionModelFigures? Diffusion = null,
    DropletFigures? Droplets = null)
{
    /// <summary>Revision, reason, requester and what the report was made from; null for a report that is not a stored record.</summary>
    public ReportProvenance? Provenance { get; init; }
}
