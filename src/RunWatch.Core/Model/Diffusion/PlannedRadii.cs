namespace RunWatch.Core.Model.Diffusion;

/// <summary>
/// The predicted radius distribution of a planned run (<see cref="GrowthPlanner"/>), with where it lies against the
/// model's calibrated range. The spread is the site geometry's only: the model's residual scatter
/// (<see cref="DiffusionRadiusModel.ResidualSdNm"/>) and parameter uncertainty are not added.
/// </summary>
/// <param name="LambdaUm">λ at the planned temperature (µm).</param>
/// <param name="RadiiNm">Predicted radius of every simulated wire (nm).</param>
/// <param name="FootprintsUm">Footprint radius each wire collected with (µm): <see cref="GrowthFootprint"/> of its radius from the previous pass.</param>
/// <param name="CaptureAreasUm2">Each wire's capture area at λ (µm²), from the diffusion solution.</param>
/// <param name="MeanRadiusNm">Mean predicted radius.</param>
/// <param name="RadiusSdNm">Wire-to-wire SD (n − 1).</param>
/// <param name="TemperatureOutside">The temperature lies outside the calibrated range (with the model's 5 K slack).</param>
/// <param name="TimeOutside">The growth time lies outside the calibrated range (with the model's 10 % slack).</param>
/// <param name="FieldUm">Side of the simulated periodic field(s) (µm).</param>
/// <param name="Fields">Number of simulated fields.</param>
public sealed record PlannedRadii(
    double LambdaUm,
    IReadOnlyList<double> RadiiNm,
    IReadOnlyList<double> FootprintsUm,
    IReadOnlyList<double> CaptureAreasUm2,
    double MeanRadiusNm,
    double RadiusSdNm,
    bool TemperatureOutside,
    bool TimeOutside,
    double FieldUm,
    int Fields)
{
    /// <summary>Coefficient of variation of the predicted radius (SD ÷ mean).</summary>
    public double RadiusCv => MeanRadiusNm > 0 ? RadiusSdNm / MeanRadiusNm : double.NaN;

    /// <summary>True when the plan leaves the calibrated temperature or time range: the model extrapolates.</summary>
    public bool Extrapolated => TemperatureOutside || TimeOutside;
}
