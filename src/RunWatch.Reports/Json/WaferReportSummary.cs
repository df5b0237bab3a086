using RunWatch.Core.Model;
using RunWatch.Core.Model.Prediction;
using RunWatch.Core.Qc;
using RunWatch.Core.Wafers;
using RunWatch.Reports.Model;

namespace RunWatch.Reports.Json;

/// <summary>The JSON summary of a wafer report: every figure of the report except the per-wire rows and images.</summary>
/// <param name="SchemaVersion">Version of this JSON shape.</param>
/// <param name="Identity">Run and wafer identity.</param>
/// <param name="Thermal">Diffusion lengths, temperatures, coverage and excursions (no samples).</param>
/// <param name="Statistics">Wire statistics.</param>
/// <param name="Model">Radius model used, or null.</param>
/// <param name="CaptureRadiusNm">L used for Â (nm).</param>
/// <param name="Prediction">Before-SEM prediction, or null.</param>
/// <param name="Comparison">After-SEM agreement (bias, RMSE, r², count), or null.</param>
/// <param name="Verdict">Verdict with every rule.</param>
/// <param name="Fields">Field names and wire counts.</param>
/// <param name="Caution">The caution footer.</param>
/// <param name="Diffusion">The diffusion radius model the wafer was judged with (parameters with intervals, λ, λ_eff), or null.</param>
public sealed record WaferReportSummary(
    int SchemaVersion,
    ReportIdentity Identity,
    ThermalFigures Thermal,
    WireStatistics Statistics,
    RadiusModelFit? Model,
    double CaptureRadiusNm,
    RadiusPrediction? Prediction,
    ComparisonFigures? Comparison,
    QcVerdict Verdict,
    IReadOnlyList<FieldFigures> Fields,
    string Caution,
    DiffusionModelFigures? Diffusion = null)
{
    /// <summary>Revision, reason, requester, configuration hash, model and input hashes; null when not a stored record.</summary>
    public ReportProvenance? Provenance { get; init; }
}
