using RunWatch.Core.Model;
using RunWatch.Core.Model.Prediction;
using RunWatch.Core.Qc;

namespace RunWatch.Core.Wafers;

/// <summary>The wafer's figures: its wires, statistics, model, predictions and verdict.</summary>
public sealed record WaferEvaluation
{
    public required IReadOnlyList<WireRow> Wires { get; init; }

    public WireStatistics? Statistics { get; init; }

    /// <summary>The radius model the verdict used.</summary>
    public WaferRadiusModel RadiusModel { get; init; } = WaferRadiusModel.Diffusion;

    /// <summary>The diffusion model's λ, λ_eff and counts for this wafer; null when the diffusion model was not applied.</summary>
    public WaferDiffusionFigures? Diffusion { get; init; }

    /// <summary>The diffusion radius model applied, null when none was.</summary>
    public Model.Diffusion.DiffusionRadiusModel? DiffusionModel { get; init; }

    /// <summary>The Â regression used for the per-wire predictions (only with <see cref="WaferRadiusModel.CaptureAreaRegression"/>).</summary>
    public RadiusModelFit? Model { get; init; }

    /// <summary>True when no accepted process model existed and the model was fitted on this wafer itself.</summary>
    public bool ModelFittedOnThisWafer { get; init; }

    /// <summary>Both candidate fits on this wafer, with the selection criterion.</summary>
    public RadiusModelComparison? ThisWaferFits { get; init; }

    /// <summary>The capture radius that fits this wafer best (for the Arrhenius calibration).</summary>
    public CaptureRadiusFit? BestCaptureRadius { get; init; }

    /// <summary>Expected radius distribution from L_eff, the measured density and the model (simulated sites).</summary>
    public RadiusPrediction? Prediction { get; init; }

    /// <summary>Per-wire predicted against measured.</summary>
    public PredictedVsMeasured? Comparison { get; init; }

    public required QcVerdict Verdict { get; init; }

    /// <summary>Cautions in words.</summary>
    public required IReadOnlyList<string> Notes { get; init; }

    /// <summary>Total analysed area over all fields, cm².</summary>
    public double AnalysedAreaCm2 { get; init; }
}
