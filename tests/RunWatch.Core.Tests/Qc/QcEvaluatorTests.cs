using RunWatch.Core.Qc;
using Xunit;

namespace RunWatch.Core.Tests.Qc;

public sealed class QcEvaluatorTests
{
    // COMMON PRACTICE (no single source): a worst-of rule set with an inner warn band, limits inclusive.

    [Fact]
    public void Evaluate_GoodWafer_PassesEveryRule()
    {
        QcVerdict verdict = QcEvaluator.Evaluate(QcTestData.GoodWafer(), QcTestData.Spec());
        Assert.Equal(QcOutcome.Pass, verdict.Outcome);
        Assert.Equal(9, verdict.Rules.Count);
        Assert.Empty(verdict.Reasons);
        Assert.Equal(["wire-count", "mean-radius", "radius-cv", "density", "vertical-yield", "prediction-bias", "excursion-count", "excursion-effect", "thermal-coverage"], verdict.Rules.Select(r => r.Rule));
    }

    public static TheoryData<WaferQcInput, string, QcOutcome> SingleRuleCases()
    {
        WaferQcInput good = QcTestData.GoodWafer();
        return new TheoryData<WaferQcInput, string, QcOutcome>
        {
            { good with { MeanRadiusNm = 71 }, "mean-radius", QcOutcome.Fail },
            { good with { MeanRadiusNm = 52.5 }, "mean-radius", QcOutcome.Warn },
            { good with { MeanRadiusNm = 70 }, "mean-radius", QcOutcome.Warn },
            { good with { RadiusCv = 0.3 }, "radius-cv", QcOutcome.Fail },
            { good with { RadiusCv = 0.22 }, "radius-cv", QcOutcome.Warn },
            { good with { DensityPerCm2 = 9e7 }, "density", QcOutcome.Fail },
            { good with { DensityPerCm2 = 7e8 }, "density", QcOutcome.Fail },
            { good with { DensityPerCm2 = 1.2e8 }, "density", QcOutcome.Warn },
            { good with { DensityPerCm2 = 5.5e8 }, "density", QcOutcome.Warn },
            { good with { VerticalYield = 0.6 }, "vertical-yield", QcOutcome.Fail },
            { good with { VerticalYield = 0.75 }, "vertical-yield", QcOutcome.Warn },
            { good with { PredictionBiasNm = -9 }, "prediction-bias", QcOutcome.Fail },
            { good with { PredictionBiasNm = 6 }, "prediction-bias", QcOutcome.Warn },
            { good with { ExcursionCount = 4 }, "excursion-count", QcOutcome.Fail },
            { good with { ExcursionCount = 2 }, "excursion-count", QcOutcome.Warn },
            { good with { MaxAbsRelativeLChange = 0.12 }, "excursion-effect", QcOutcome.Fail },
            { good with { MaxAbsRelativeLChange = 0.07 }, "excursion-effect", QcOutcome.Warn },
            { good with { ThermalCoverage = 0.85 }, "thermal-coverage", QcOutcome.Fail },
            { good with { ThermalCoverage = 0.95 }, "thermal-coverage", QcOutcome.Warn },
            { good with { WireCount = 12 }, "wire-count", QcOutcome.Fail },
            { good with { ThermalCoverage = null }, "thermal-coverage", QcOutcome.Warn },
        };
    }

    [Theory]
    [MemberData(nameof(SingleRuleCases))]
    public void Evaluate_OneValueOutOfBand_OnlyThatRuleAndVerdictChange(WaferQcInput input, string rule, QcOutcome expected)
    {
        QcVerdict verdict = QcEvaluator.Evaluate(input, QcTestData.Spec());
        Assert.Equal(expected, verdict.Outcome);
        QcRuleResult reason = Assert.Single(verdict.Reasons);
        Assert.Equal(rule, reason.Rule);
        Assert.Equal(expected, reason.Outcome);
        Assert.False(string.IsNullOrWhiteSpace(reason.Reason));
    }

    [Fact]
    public void Evaluate_ValueExactlyAtFailLimit_Passes()
    {
        QcVerdict verdict = QcEvaluator.Evaluate(QcTestData.GoodWafer() with { RadiusCv = 0.2, VerticalYield = 0.8 }, QcTestData.Spec());
        Assert.Equal(QcOutcome.Pass, verdict.Outcome);
    }

    [Fact]
    public void Evaluate_FailAndWarn_VerdictIsFailAndReasonsWorstFirst()
    {
        WaferQcInput input = QcTestData.GoodWafer() with { RadiusCv = 0.22, MeanRadiusNm = 80 };
        QcVerdict verdict = QcEvaluator.Evaluate(input, QcTestData.Spec());
        Assert.Equal(QcOutcome.Fail, verdict.Outcome);
        Assert.Equal(["mean-radius", "radius-cv"], verdict.Reasons.Select(r => r.Rule));
        QcRuleResult mean = verdict.Reasons[0];
        Assert.Equal(80, mean.Measured);
        Assert.Equal("nm", mean.Unit);
        Assert.Equal("60 ± 10", mean.Limit);
        Assert.Contains("20 nm from the target", mean.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void Evaluate_MissingValueWithFailPolicy_Fails()
    {
        QcSpecification spec = QcTestData.Spec();
        spec.MissingValueOutcome = QcOutcome.Fail;
        QcVerdict verdict = QcEvaluator.Evaluate(QcTestData.GoodWafer() with { PredictionBiasNm = null }, spec);
        Assert.Equal(QcOutcome.Fail, verdict.Outcome);
        Assert.Contains("not measured", verdict.Reasons[0].Reason, StringComparison.Ordinal);
        Assert.Null(verdict.Reasons[0].Measured);
    }

    [Fact]
    public void Evaluate_UnconfiguredRules_AreNotEvaluated()
    {
        var spec = new QcSpecification { MaxRadiusCv = 0.3 };
        QcVerdict verdict = QcEvaluator.Evaluate(QcTestData.GoodWafer() with { ThermalCoverage = null }, spec);
        Assert.Equal("radius-cv", Assert.Single(verdict.Rules).Rule);
        Assert.Equal(QcOutcome.Pass, verdict.Outcome);
    }

    [Fact]
    public void Evaluate_InvalidSpec_ThrowsWithProblems()
    {
        var spec = new QcSpecification { MaxRadiusCv = 0.2, WarnRadiusCv = 0.3 };
        var ex = Assert.Throws<ArgumentException>(() => QcEvaluator.Evaluate(QcTestData.GoodWafer(), spec));
        Assert.Contains("WarnRadiusCv", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Evaluate_NegativeBias_ReportsSignedMeasuredValue()
    {
        QcVerdict verdict = QcEvaluator.Evaluate(QcTestData.GoodWafer() with { PredictionBiasNm = -6 }, QcTestData.Spec());
        Assert.Equal(-6, verdict.Reasons.Single().Measured);
    }
}
