using RunWatch.Storage;

namespace RunWatch.Web.Data;

/// <summary>A run with its thermal result, excursions and predicted radius.</summary>
public sealed record RunDetail(RunSummary Summary, ThermalResult? Thermal, IReadOnlyList<ExcursionView> Excursions, RadiusPrediction? Prediction, string TemperatureChannel)
{
    /// <summary>The run-end figures of the process's accepted diffusion model; null when none was accepted at the run's end.</summary>
    public RunDiffusionFigures? Diffusion { get; init; }
}
