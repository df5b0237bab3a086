namespace RunWatch.Web.Data;

/// <summary>
/// The process model a planner prediction used: the radius model r(Â) and the diffusivity D(T) = D0·exp(−Ea/(kB·T))
/// with the convention factor c of L = √(c·∫D dt). Each part says who accepted it and when, or that it is the
/// configured default because the process has no accepted one.
/// </summary>
public sealed record PlannerModel(
    string Process,
    RadiusModelForm RadiusForm,
    double RadiusA,
    double RadiusB,
    string? RadiusAcceptedBy,
    DateTimeOffset? RadiusAcceptedAt,
    double D0CmSquaredPerSecond,
    double ActivationEnergyEv,
    double ConventionFactor,
    string? DiffusivityAcceptedBy,
    DateTimeOffset? DiffusivityAcceptedAt)
{
    /// <summary>True when no accepted radius model exists and the configured default is used.</summary>
    public bool RadiusIsDefault => RadiusAcceptedBy is null;

    /// <summary>True when no accepted Arrhenius calibration exists and the configured default is used.</summary>
    public bool DiffusivityIsDefault => DiffusivityAcceptedBy is null;
}
