namespace RunWatch.Web.Data;

/// <summary>Planner output: L_eff, T_eff, sampled predicted radii, the density–radius trade-off and, when the engine knows it, the model used.</summary>
public sealed record PlannerResult(double LEffNm, double TEffC, IReadOnlyList<double> RadiiNm, IReadOnlyList<TradeOffPoint> TradeOff, PlannerModel? Model = null);
