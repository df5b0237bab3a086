namespace RunWatch.Web.Data;

/// <summary>Planner output: L_eff, T_eff, sampled predicted radii and the density–radius trade-off.</summary>
public sealed record PlannerResult(double LEffNm, double TEffC, IReadOnlyList<double> RadiiNm, IReadOnlyList<TradeOffPoint> TradeOff);
