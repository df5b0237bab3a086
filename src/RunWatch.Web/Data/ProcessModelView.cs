namespace RunWatch.Web.Data;

/// <summary>A process's radius model and Arrhenius fit, the data behind them and a candidate refit awaiting acceptance.</summary>
public sealed record ProcessModelView(string Process, RadiusFit Current, RadiusFit? Candidate, ArrheniusFit Arrhenius, IReadOnlyList<ModelPoint> RadiusData, IReadOnlyList<ArrheniusPoint> ArrheniusData, string? AcceptedBy, DateTimeOffset? AcceptedAt);
