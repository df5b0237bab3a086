using RunWatch.Core.Model;
using RunWatch.Core.Qc;

namespace RunWatch.Core.Wafers;

/// <summary>Everything the wafer evaluation judges, gathered from the store.</summary>
public sealed record WaferEvaluationInput
{
    public required string WaferId { get; init; }

    public required string Recipe { get; init; }

    public required IReadOnlyList<FieldResult> Fields { get; init; }

    /// <summary>The process's accepted radius model; null when none has been accepted yet.</summary>
    public RadiusModelFit? AcceptedModel { get; init; }

    public required RunThermalFacts Thermal { get; init; }

    public required QcSpecification Specification { get; init; }

    public int PredictionSeed { get; init; } = 1;

    public int PredictionFields { get; init; } = 8;

    public double CaptureRadiusSearchMin { get; init; } = 0.25;

    public double CaptureRadiusSearchMax { get; init; } = 3.0;
}
