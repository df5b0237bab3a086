using RunWatch.Core.Qc;

namespace RunWatch.Core.Tests.Qc;

/// <summary>An invented recipe specification and a wafer that passes every rule with room to spare.</summary>
internal static class QcTestData
{
    public static QcSpecification Spec() => new()
    {
        TargetMeanRadiusNm = 60,
        MeanRadiusToleranceNm = 10,
        MeanRadiusWarnToleranceNm = 6,
        MaxRadiusCv = 0.25,
        WarnRadiusCv = 0.2,
        MinDensityPerCm2 = 1e8,
        MaxDensityPerCm2 = 6e8,
        WarnMinDensityPerCm2 = 1.5e8,
        WarnMaxDensityPerCm2 = 5e8,
        MinVerticalYield = 0.7,
        WarnVerticalYield = 0.8,
        MaxAbsBiasNm = 8,
        WarnAbsBiasNm = 5,
        MaxExcursionCount = 3,
        WarnExcursionCount = 1,
        MaxAbsRelativeLChange = 0.1,
        WarnAbsRelativeLChange = 0.05,
        MinThermalCoverage = 0.9,
        WarnThermalCoverage = 0.98,
        MinWireCount = 30,
    };

    public static WaferQcInput GoodWafer() => new("W-DEMO-0001", "nw-gaas-std", 250, 61, 0.12, 3e8, 0.9, 1.5, 0, 0.0, 1.0);
}
