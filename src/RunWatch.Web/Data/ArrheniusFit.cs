namespace RunWatch.Web.Data;

/// <summary>Fitted diffusivity D = D0·exp(−Ea/(kB·T)).</summary>
public sealed record ArrheniusFit(double D0CmSquaredPerSecond, double ActivationEnergyEv, double RSquared);
