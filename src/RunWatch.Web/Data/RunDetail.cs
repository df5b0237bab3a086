namespace RunWatch.Web.Data;

/// <summary>A run with its thermal result, excursions and predicted radius.</summary>
public sealed record RunDetail(RunSummary Summary, ThermalResult? Thermal, IReadOnlyList<ExcursionView> Excursions, RadiusPrediction? Prediction, string TemperatureChannel);
