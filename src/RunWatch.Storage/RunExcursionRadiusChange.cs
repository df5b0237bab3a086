namespace RunWatch.Storage;

/// <summary>One excursion's effect on a run's expected mean radius under the accepted diffusion model.</summary>
/// <param name="StartS">Start, seconds from the run's start.</param>
/// <param name="EndS">End, seconds from the run's start.</param>
/// <param name="MeanRadiusChangeNm">r(real history) − r(the excursion read as the setpoint), nm; positive: thicker wires.</param>
/// <param name="LambdaEffChangeNm">The same change in λ_eff, nm.</param>
public sealed record RunExcursionRadiusChange(double StartS, double EndS, double? MeanRadiusChangeNm, double? LambdaEffChangeNm);
