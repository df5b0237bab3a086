using RunWatch.Core.Model;
using RunWatch.Core.Model.Diffusion;
using RunWatch.Core.Qc;
using RunWatch.Core.Thermal;

namespace RunWatch.Core.Wafers;

/// <summary>Everything the wafer evaluation judges, gathered from the store.</summary>
public sealed record WaferEvaluationInput
{
    public required string WaferId { get; init; }

    public required string Recipe { get; init; }

    /// <summary>Process (recipe family) whose models are used; the recipe when null. Named in the verdict's reasons.</summary>
    public string? Process { get; init; }

    /// <summary>Which radius model predicts the wires. <value>Default <see cref="WaferRadiusModel.Diffusion"/>.</value></summary>
    public WaferRadiusModel RadiusModel { get; init; } = WaferRadiusModel.Diffusion;

    /// <summary>The process's accepted diffusion radius model; null when none has been accepted (the verdict then says so).</summary>
    public DiffusionRadiusModel? DiffusionModel { get; init; }

    /// <summary>
    /// The run's real growth history (true temperatures over the growth window, from the stored record); null when the
    /// wafer has no run or the run no record, with <see cref="GrowthExposureMissing"/> saying why.
    /// </summary>
    public ThermalExposure? GrowthExposure { get; init; }

    /// <summary>Why <see cref="GrowthExposure"/> is null, in words.</summary>
    public string? GrowthExposureMissing { get; init; }

    /// <summary>How capture areas are solved for the diffusion options (cell size, guard tolerance, parallelism).</summary>
    public CaptureTableOptions? CaptureTable { get; init; }

    public required IReadOnlyList<FieldResult> Fields { get; init; }

    /// <summary>The process's accepted Â regression (used only with <see cref="WaferRadiusModel.CaptureAreaRegression"/>); null when none has been accepted yet.</summary>
    public RadiusModelFit? AcceptedModel { get; init; }

    public required RunThermalFacts Thermal { get; init; }

    public required QcSpecification Specification { get; init; }

    public int PredictionSeed { get; init; } = 1;

    public int PredictionFields { get; init; } = 8;

    public double CaptureRadiusSearchMin { get; init; } = 0.25;

    public double CaptureRadiusSearchMax { get; init; } = 3.0;
}
