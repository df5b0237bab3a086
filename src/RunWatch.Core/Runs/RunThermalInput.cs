using RunWatch.Core.Excursions;
using RunWatch.Core.Thermal;

namespace RunWatch.Core.Runs;

/// <summary>What one run's thermal evaluation needs, whoever read the record (the daemon's store or a CSV log).</summary>
/// <param name="Record">The growth-temperature channel as read (instrument scale), s from the run's origin.</param>
/// <param name="SetpointsC">The setpoint in force at each sample of <paramref name="Record"/>, true °C; NaN where none (band checks suspended).</param>
/// <param name="Window">The growth window: L_eff integrates it only, and only an excursion's overlap with it changes L_eff.</param>
/// <param name="Diffusivity">Arrhenius diffusivity of the process.</param>
/// <param name="Calibration">Reading → true temperature.</param>
/// <param name="Length">Convention factor and gap limit of the diffusion length.</param>
/// <param name="Excursions">Bands, limits and gap limit of the excursion check.</param>
/// <param name="Plan">Setpoint (true °C) and planned time for L_nom, when known.</param>
public sealed record RunThermalInput(
    ThermalRecord Record,
    double[] SetpointsC,
    GrowthWindow Window,
    ArrheniusDiffusivity Diffusivity,
    TemperatureCalibration Calibration,
    DiffusionLengthOptions Length,
    ExcursionOptions Excursions,
    GrowthPlan? Plan);
