using RunWatch.Core.Model.Prediction;
using RunWatch.Core.Qc;
using RunWatch.Core.Wafers;

namespace RunWatch.Storage.Tests;

/// <summary>The report digest the dashboard reads: written and read only through Storage's WaferReportDigestJson.</summary>
public sealed class WaferReportDigestJsonTests
{
    [Fact]
    public void Write_ThenRead_SameDigest()
    {
        var statistics = new WireStatistics(120, 41.5, 5.25, 5.25 / 41.5, 41, 30, 55, 1.2e9, 0.9);
        var prediction = new RadiusPrediction(40, 5, 0.125, 32, 40, 49, 1.5, 480, 4, 1, 600, 1.1e9, RunWatch.Core.Model.RadiusModelKind.Linear, "invented");
        var verdict = new QcVerdict("W-INV-1", "nw-inv", QcOutcome.Warn,
        [
            new QcRuleResult("cv", "radius CV", 0.126, "≤ 0.15", "≤ 0.12", "", QcOutcome.Warn, "CV 0.126 is inside the warn band"),
            new QcRuleResult("count", "wire count", 120, "≥ 50", "", "", QcOutcome.Pass, ""),
        ]);
        var digest = new WaferReportDigest(statistics, prediction, verdict);

        WaferReportDigest back = WaferReportDigestJson.Read(WaferReportDigestJson.Write(digest));

        Assert.Equal(statistics, back.Statistics);
        Assert.Equal(prediction, back.Prediction);
        Assert.Equal(verdict.Outcome, back.Verdict!.Outcome);
        Assert.Equal(verdict.Rules, back.Verdict.Rules);
    }

    [Fact]
    public void Read_WholeReportSummaryAsStoredBefore_ReadsItsStatisticsPredictionAndVerdict()
    {
        // The form the reports table held before the digest: the whole JSON report summary, with more members.
        const string Stored = """
            {"schemaVersion":1,"identity":{"wafer":"W-INV-2"},"statistics":{"count":80,"meanRadiusNm":38.5,"radiusSdNm":4,"densityPerCm2":9e8},
             "prediction":{"meanRadiusNm":40,"radiusSdNm":5,"p05Nm":32,"p95Nm":49},
             "verdict":{"waferId":"W-INV-2","recipe":"nw-inv","outcome":"Fail","rules":[{"rule":"mean","outcome":"Fail","reason":"mean 38.5 nm below 40 nm"}]},
             "caution":"invented"}
            """;

        WaferReportDigest digest = WaferReportDigestJson.Read(Stored);

        Assert.Equal(80, digest.Statistics!.Count);
        Assert.Equal(9e8, digest.Statistics.DensityPerCm2);
        Assert.Equal(49, digest.Prediction!.P95Nm);
        Assert.Equal(QcOutcome.Fail, digest.Verdict!.Outcome);
        Assert.Equal("mean 38.5 nm below 40 nm", Assert.Single(digest.Verdict.Rules).Reason);
    }

    [Fact]
    public void Write_WithDiffusionFigures_ReadsThemBackAndOlderDigestsHaveNone()
    {
        var figures = new WaferDiffusionDigest(42, "Diffusion", 605.2, 1000, 628.1, 547.4, 525, 658, 34, 86, Extrapolated: true);
        var digest = new WaferReportDigest(null, null, null, new WaferAgreementDigest(34, 0.17, 1.2, 0.86, 0.9), figures);

        WaferReportDigest back = WaferReportDigestJson.Read(WaferReportDigestJson.Write(digest));

        Assert.Equal(figures, back.Diffusion);
        Assert.Equal(digest.Agreement, back.Agreement);
        Assert.Null(WaferReportDigestJson.Read(WaferReportDigestJson.Write(new WaferReportDigest(null, null, null))).Diffusion);
        Assert.Null(WaferReportDigestJson.Read("{\"statistics\":null}").Diffusion);
    }

    [Fact]
    public void Read_NotADigest_EmptyDigestNotAnException()
    {
        Assert.Equal(new WaferReportDigest(null, null, null), WaferReportDigestJson.Read("{\"statistics\":"));
    }
}
