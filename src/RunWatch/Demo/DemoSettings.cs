using System.Globalization;
using RunWatch.Simulation.Demo;

namespace RunWatch.Demo;

/// <summary>
/// The invented demo scenario: one MBE-style chamber "demo-1" at site "lab", an invented GaAs-like process, two
/// runs at different growth temperatures, and a QC specification for the demo recipe. Nothing here describes a real
/// instrument or process.
/// </summary>
internal static class DemoSettings
{
    /// <summary>Simulated time runs this many times faster than the wall clock.</summary>
    public const double Acceleration = 60;

    /// <summary>Embedded broker port of the demo (1883 is often taken by a system broker).</summary>
    public const int BrokerPort = 1884;

    /// <summary>Nucleation density of the demo wafers, cm⁻².</summary>
    public const double DensityPerCm2 = 1e9;

    public const int FieldsPerWafer = 3;

    /// <summary>
    /// Invented process: Ea = 1.3 eV and D0 chosen so that L_eff ≈ 0.3 µm over a 30-minute growth at 610 °C
    /// (c = 1). The record is compressed by <see cref="Acceleration"/>, so the daemon is given D0 × Acceleration:
    /// the integral over the compressed record then equals the one over the simulated growth.
    /// </summary>
    public const double D0CmSqPerS = 1.3e-5;

    public const double EaEv = 1.3;

    /// <summary>Deviation from setpoint that raises a warning (and, below, an alarm) on the demo chamber, K.</summary>
    public const double WarningBandK = 5;

    public const double AlarmBandK = 15;

    public static IReadOnlyList<DemoRunPlan> Runs { get; } =
    [
        new("R-DEMO-01", ["W-DEMO-01-A", "W-DEMO-01-B"], 610, 101),
        new("R-DEMO-02", ["W-DEMO-02-A"], 590, 202),
    ];

    /// <summary>Configuration arguments of the demo; the user's own arguments come after them and win.</summary>
    public static string[] Arguments(string dataFolder) =>
    [
        "--Storage:DataDirectory=" + dataFolder,
        "--ChambersFile=" + Path.Combine(dataFolder, "demo-chambers.json"),
        "--Broker:Mode=Embedded",
        "--Broker:Port=" + BrokerPort.ToString(CultureInfo.InvariantCulture),
        "--Broker:ClientId=runwatch-demo-daemon",
        "--Intake:StableFor=00:00:01",
        "--Intake:RescanInterval=00:00:01",
        "--WaferPipeline:DefaultProcess=nw-demo",
        // This demo's invented radii are still made with the Â formula (DemoWaferFields.Write), so it is judged with
        // that named option; drop this line once the demo's truth comes from the adatom simulation and the demo refits
        // and accepts the diffusion model (docs/model.md).
        "--WaferPipeline:RadiusModel=CaptureAreaRegression",
        "--Serilog:MinimumLevel:Default=Warning",
        // The dashboard draws its bands from its own settings; keep them equal to the demo chamber's alert bands.
        "--RunWatch:Dashboard:WarningBandK=" + WarningBandK.ToString(CultureInfo.InvariantCulture),
        "--RunWatch:Dashboard:AlarmBandK=" + AlarmBandK.ToString(CultureInfo.InvariantCulture),
        "--Serilog:WriteTo:1:Args:path=" + Path.Combine(dataFolder, "logs", "runwatch-.log"),
        "--Qc:Recipes:nw-demo:TargetMeanRadiusNm=30",
        "--Qc:Recipes:nw-demo:MeanRadiusToleranceNm=8",
        "--Qc:Recipes:nw-demo:MeanRadiusWarnToleranceNm=5",
        "--Qc:Recipes:nw-demo:MaxRadiusCv=0.35",
        "--Qc:Recipes:nw-demo:WarnRadiusCv=0.25",
        "--Qc:Recipes:nw-demo:MinDensityPerCm2=5e8",
        "--Qc:Recipes:nw-demo:MaxDensityPerCm2=2e9",
        "--Qc:Recipes:nw-demo:MinVerticalYield=0.8",
        "--Qc:Recipes:nw-demo:WarnVerticalYield=0.9",
        "--Qc:Recipes:nw-demo:MaxAbsBiasNm=4",
        "--Qc:Recipes:nw-demo:WarnAbsBiasNm=2",
        "--Qc:Recipes:nw-demo:MaxExcursionCount=2",
        "--Qc:Recipes:nw-demo:WarnExcursionCount=1",
        "--Qc:Recipes:nw-demo:MaxAbsRelativeLChange=0.05",
        "--Qc:Recipes:nw-demo:WarnAbsRelativeLChange=0.02",
        "--Qc:Recipes:nw-demo:MinThermalCoverage=0.95",
        "--Qc:Recipes:nw-demo:WarnThermalCoverage=0.99",
        "--Qc:Recipes:nw-demo:MinWireCount=100",
    ];

    /// <summary>The demo chamber file (same format as config/chambers.json), with limits scaled to accelerated time.</summary>
    public static string ChambersJson() => string.Create(CultureInfo.InvariantCulture, $$"""
        {
          "Chambers": [
            {
              "Name": "demo-1",
              "Site": "lab",
              "Description": "Invented demo chamber (not a real instrument): MBE-style heater under PID, thermocouple reading, Ga shutter. Time runs {{Acceleration}}x fast.",
              "Channels": [
                { "Name": "substrate_tc", "Role": "GrowthTemperature", "Unit": "degC", "Min": -50, "Max": 1200 },
                { "Name": "substrate_sp", "Role": "Setpoint", "Unit": "degC", "Min": -50, "Max": 1200 },
                { "Name": "ga_shutter", "Role": "GrowthShutter", "Unit": "1", "Min": 0, "Max": 1 }
              ],
              "Runs": { "Mode": "Events", "PlannedTimeoutFactor": 3.0, "TimeoutGrace": "00:01:00", "NoTelemetryTimeout": "00:01:00" },
              "Process": { "D0CmSqPerS": {{D0CmSqPerS * Acceleration}}, "EaEv": {{EaEv}} },
              "DiffusionLength": { "ConventionFactor": 1.0, "MaxGap": "00:00:02" },
              "Excursions": {
                "WarningBandK": {{WarningBandK}}, "AlarmBandK": {{AlarmBandK}}, "HysteresisK": 1, "MinimumDuration": "00:00:00.500",
                "HighLimitC": 700, "LowLimitC": 150, "MaxRateKPerS": 300, "RateWindow": "00:00:01",
                "StaleAfter": "00:00:10", "FlatlineWindow": "00:05:00", "FlatlineEpsilonK": 0.01, "MaxGap": "00:00:02"
              }
            }
          ]
        }
        """);
}
