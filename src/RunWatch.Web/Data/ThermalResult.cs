namespace RunWatch.Web.Data;

/// <summary>Diffusion lengths of a run: L_nom from setpoint and planned time, L_eff from the recorded history; c is the convention factor in L = sqrt(c·∫D dt).</summary>
public sealed record ThermalResult(double LNomNm, double LEffNm, double TEffC, double ConventionFactor, double CoveragePercent, double D0CmSquaredPerSecond, double ActivationEnergyEv);
