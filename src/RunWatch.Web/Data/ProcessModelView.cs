namespace RunWatch.Web.Data;

/// <summary>
/// A process's radius model and Arrhenius fit, the data behind them and a candidate refit awaiting acceptance.
/// <see cref="AcceptedBy"/> is null when no radius model has been accepted yet (then <see cref="Current"/> is the
/// newest proposal); <see cref="CandidateArrhenius"/> is a proposed Arrhenius fit not yet accepted.
/// </summary>
public sealed record ProcessModelView(string Process, RadiusFit Current, RadiusFit? Candidate, ArrheniusFit Arrhenius, IReadOnlyList<ModelPoint> RadiusData,
    IReadOnlyList<ArrheniusPoint> ArrheniusData, string? AcceptedBy, DateTimeOffset? AcceptedAt, ArrheniusFit? CandidateArrhenius = null, DiffusionModelView? Diffusion = null);
