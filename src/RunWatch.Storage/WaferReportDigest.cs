using RunWatch.Core.Model.Prediction;
using RunWatch.Core.Qc;
using RunWatch.Core.Wafers;

namespace RunWatch.Storage;

/// <summary>
/// What the store keeps of a wafer's report for the screens (<see cref="WaferReportRecord.SummaryJson"/> of the JSON
/// report): its wire statistics, the radius prediction made before SEM and the verdict with every rule. Written by
/// the wafer room, read by the dashboard, both through <see cref="WaferReportDigestJson"/>.
/// </summary>
/// <param name="Statistics">Wire statistics of the wafer, null when too few wires.</param>
/// <param name="Prediction">Expected radius distribution from L_eff, null when it could not be made.</param>
/// <param name="Verdict">The QC verdict with every rule.</param>
/// <param name="Agreement">Predicted against measured radius per wire, null when not compared (older digests too).</param>
/// <param name="Diffusion">The diffusion radius model's figures for the wafer, null when it was not applied (older digests too).</param>
public sealed record WaferReportDigest(WireStatistics? Statistics, RadiusPrediction? Prediction, QcVerdict? Verdict, WaferAgreementDigest? Agreement = null,
    WaferDiffusionDigest? Diffusion = null);
