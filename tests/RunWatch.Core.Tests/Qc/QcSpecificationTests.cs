using RunWatch.Core.Qc;
using Xunit;

namespace RunWatch.Core.Tests.Qc;

public sealed class QcSpecificationTests
{
    [Fact]
    public void Validate_SampleSpec_IsValid()
    {
        Assert.Empty(QcTestData.Spec().Validate());
        Assert.Empty(new QcSpecification().Validate());
    }

    public static TheoryData<Action<QcSpecification>, string> BadSpecs() => new()
    {
        { s => s.MeanRadiusToleranceNm = null, "set together" },
        { s => s.MeanRadiusWarnToleranceNm = 12, "MeanRadiusWarnToleranceNm" },
        { s => s.TargetMeanRadiusNm = -5, "TargetMeanRadiusNm" },
        { s => s.MaxRadiusCv = 0, "MaxRadiusCv" },
        { s => s.WarnRadiusCv = 0.3, "WarnRadiusCv" },
        { s => s.MaxDensityPerCm2 = 5e7, "MaxDensityPerCm2" },
        { s => s.WarnMinDensityPerCm2 = 5e7, "WarnMinDensityPerCm2" },
        { s => s.WarnMaxDensityPerCm2 = 7e8, "WarnMaxDensityPerCm2" },
        { s => s.MinVerticalYield = 70, "fraction" },
        { s => s.WarnVerticalYield = 0.6, "WarnVerticalYield" },
        { s => s.WarnExcursionCount = 5, "WarnExcursionCount" },
        { s => s.MaxExcursionCount = -1, "MaxExcursionCount" },
        { s => s.WarnThermalCoverage = 1.5, "WarnThermalCoverage" },
        { s => s.MinWireCount = 0, "MinWireCount" },
        { s => s.DropletContactAngleDeg = 90, "DropletContactAngleDeg" },
        { s => s.DropletContactAngleDeg = 180, "DropletContactAngleDeg" },
        { s => s.DropletContactAngleDeg = double.NaN, "DropletContactAngleDeg" },
        { s => s.MissingValueOutcome = (QcOutcome)7, "MissingValueOutcome" },
    };

    [Theory]
    [MemberData(nameof(BadSpecs))]
    public void Validate_BadValue_ReportsProblemNamingTheSetting(Action<QcSpecification> spoil, string expected)
    {
        QcSpecification spec = QcTestData.Spec();
        spoil(spec);
        IReadOnlyList<string> errors = spec.Validate();
        Assert.Contains(errors, e => e.Contains(expected, StringComparison.Ordinal));
    }

    [Fact]
    public void QcOptions_Validate_PrefixesRecipeName()
    {
        var options = new QcOptions { Default = new QcSpecification { MaxRadiusCv = -1 } };
        options.Recipes["nw-gaas-std"] = new QcSpecification { MinVerticalYield = 2 };
        IReadOnlyList<string> errors = options.Validate();
        Assert.Contains(errors, e => e.StartsWith("Recipes:nw-gaas-std:", StringComparison.Ordinal));
        Assert.Contains(errors, e => e.StartsWith("Default:", StringComparison.Ordinal));
    }

    [Fact]
    public void QcOptions_SpecificationFor_FallsBackToDefaultOrThrows()
    {
        var specific = new QcSpecification { MaxRadiusCv = 0.2 };
        var options = new QcOptions();
        options.Recipes["a"] = specific;
        Assert.Same(specific, options.SpecificationFor("a"));
        var ex = Assert.Throws<KeyNotFoundException>(() => options.SpecificationFor("b"));
        Assert.Contains("'b'", ex.Message, StringComparison.Ordinal);
        options.Default = new QcSpecification();
        Assert.Same(options.Default, options.SpecificationFor("b"));
    }
}
