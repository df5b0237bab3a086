using RunWatch.Core.Model;

namespace RunWatch.Core.Model.Prediction;

/// <summary>Expected radius distribution of a wafer before its SEM images arrive.</summary>
/// <param name="MeanRadiusNm">Mean predicted radius over all simulated wires.</param>
/// <param name="RadiusSdNm">Wire-to-wire SD of the predicted radius (sample SD).</param>
/// <param name="RadiusCv">SD / mean.</param>
/// <param name="P05Nm">5th percentile of the predicted radius.</param>
/// <param name="P50Nm">Median.</param>
/// <param name="P95Nm">95th percentile.</param>
/// <param name="FieldMeanSdNm">SD of the per-field mean radius: the spread expected between fields.</param>
/// <param name="WireCount">Simulated wires that passed the guard zone.</param>
/// <param name="Fields">Simulated fields.</param>
/// <param name="Seed">Base seed used.</param>
/// <param name="CaptureRadiusNm">L_eff used (nm).</param>
/// <param name="DensityPerCm2">Nucleation density used (cm⁻²).</param>
/// <param name="ModelKind">Radius model form used.</param>
/// <param name="Note">What the spread does and does not contain.</param>
public sealed record RadiusPrediction(
    double MeanRadiusNm,
    double RadiusSdNm,
    double RadiusCv,
    double P05Nm,
    double P50Nm,
    double P95Nm,
    double FieldMeanSdNm,
    int WireCount,
    int Fields,
    int Seed,
    double CaptureRadiusNm,
    double DensityPerCm2,
    RadiusModelKind ModelKind,
    string Note);
