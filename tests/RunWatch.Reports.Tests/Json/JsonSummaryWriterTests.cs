using System.Text.Json;
using RunWatch.Reports.Json;
using RunWatch.Reports.Tests.Support;
using Xunit;

namespace RunWatch.Reports.Tests.Json;

public sealed class JsonSummaryWriterTests
{
    [Fact]
    public void Write_SampleReport_RoundTripsFiguresAndVerdict()
    {
        var report = SampleReport.Build();
        string json = JsonSummaryWriter.Write(report);
        WaferReportSummary back = JsonSummaryWriter.Read(json);

        Assert.Equal(JsonSummaryWriter.SchemaVersion, back.SchemaVersion);
        Assert.Equal(report.Identity.WaferId, back.Identity.WaferId);
        Assert.Equal(report.Verdict.Outcome, back.Verdict.Outcome);
        Assert.Equal(report.Verdict.Rules.Select(r => r.Reason), back.Verdict.Rules.Select(r => r.Reason));
        Assert.Equal(report.Thermal.EffectiveLengthNm, back.Thermal.EffectiveLengthNm);
        Assert.Equal(report.Model!.Parameters[1].Value, back.Model!.Parameters[1].Value);
        Assert.Equal(report.Comparison!.BiasNm, back.Comparison!.BiasNm);
        Assert.Equal(report.Thermal.TimesS.Count, back.Thermal.SampleCount);
        Assert.Equal(ReportWording.Caution, back.Caution);
        using JsonDocument doc = JsonDocument.Parse(json);
        Assert.Equal("Warn", doc.RootElement.GetProperty("verdict").GetProperty("outcome").GetString());
    }

    [Fact]
    public void Write_MaliciousWaferId_IsEscapedInJsonAndReadBackIntact()
    {
        const string Malicious = "<script>alert(1)</script>";
        string json = JsonSummaryWriter.Write(SampleReport.Build(Malicious));
        Assert.DoesNotContain("<script>", json, StringComparison.Ordinal);
        Assert.Equal(Malicious, JsonSummaryWriter.Read(json).Identity.WaferId);
    }
}
