using Bunit;
using RunWatch.Core.Model.Prediction;
using RunWatch.Core.Qc;
using RunWatch.Core.Wafers;
using RunWatch.Storage;
using RunWatch.Web.Components.Shared;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Components.Shared;

/// <summary>The wafer page's revision list and the comparison of two revisions (invented wafer and figures).</summary>
public sealed class ReportRevisionsTests
{
    private static readonly DateTimeOffset T0 = new(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);

    [Fact]
    public void Render_TwoRevisions_ListsBothAndMarksWhatChanged()
    {
        var store = new RevisionStoreStub(
            Revision(1, "first issue", "intake", 44.1, QcOutcome.Pass, "pass", "aaaa"),
            Revision(2, "re-analysis requested: new threshold", "eve-engineer", 47.3, QcOutcome.Warn, "warn", "bbbb"));
        using var ctx = new DashboardTestContext(revisions: store);

        var cut = ctx.Render<ReportRevisions>(p => p.Add(c => c.WaferId, "W-INV-9"));

        Assert.Equal(2, cut.FindAll("[data-testid=revision]").Count);
        Assert.Contains("eve-engineer", cut.Find("[data-testid=revision-list]").TextContent, StringComparison.Ordinal);
        Assert.Contains("re-analysis requested: new threshold", cut.Find("[data-testid=revision-list]").TextContent, StringComparison.Ordinal);
        var changed = cut.FindAll("[data-testid=revision-change]").Select(r => r.TextContent).ToList();
        Assert.Contains(changed, t => t.Contains("verdict", StringComparison.Ordinal) && t.Contains("PASS", StringComparison.Ordinal) && t.Contains("WARN", StringComparison.Ordinal));
        Assert.Contains(changed, t => t.Contains("mean radius", StringComparison.Ordinal) && t.Contains("44.1 nm", StringComparison.Ordinal) && t.Contains("47.3 nm", StringComparison.Ordinal));
        Assert.Contains(changed, t => t.StartsWith("rule: mean radius against target", StringComparison.Ordinal));
        var same = cut.FindAll("[data-testid=revision-same]").Select(r => r.TextContent).ToList();
        Assert.Contains(same, t => t.StartsWith("wires measured", StringComparison.Ordinal));
        Assert.Contains(same, t => t.StartsWith("radius model", StringComparison.Ordinal));
    }

    [Fact]
    public void Render_NoRevisionStore_SaysSoInsteadOfAnEmptyList()
    {
        using var ctx = new DashboardTestContext();

        var cut = ctx.Render<ReportRevisions>(p => p.Add(c => c.WaferId, "W-INV-9"));

        Assert.Contains("keeps no report revisions", cut.Find("[data-testid=revisions-unavailable]").TextContent, StringComparison.Ordinal);
    }

    private static ReportRevisionRecord Revision(int n, string reason, string requester, double meanNm, QcOutcome outcome, string verdict, string hash)
    {
        var stats = new WireStatistics(120, meanNm, 6.2, 6.2 / meanNm, meanNm, meanNm - 15, meanNm + 15, 2.5e8, 0.9);
        var rules = new[] { new QcRuleResult("mean-radius", "mean radius against target", meanNm, "45 ± 5", "45 ± 2", "nm", outcome, "invented") };
        var digest = new WaferReportDigest(stats, null, new QcVerdict("W-INV-9", "inv-recipe", outcome, rules), new WaferAgreementDigest(100, 0.4, 3.1, 0.9, 2.5));
        return new ReportRevisionRecord
        {
            Wafer = "W-INV-9", Revision = n, CreatedAt = T0.AddHours(n), Reason = reason, Requester = requester, SoftwareVersion = "1.0",
            ConfigSha256 = "c0ffee", ConfigJson = "{}", ModelId = "radius model fit #3", Inputs = [new ReportInputHash(1, "W-INV-9_f1.png", "/drop/W-INV-9_f1.png", "abcd")],
            ContentSha256 = hash, Folder = "/reports/W-INV-9/r" + n, Verdict = verdict, DigestJson = WaferReportDigestJson.Write(digest),
        };
    }

    /// <summary>Hand-written stand-in: serves the revisions it was given.</summary>
    private sealed class RevisionStoreStub(params ReportRevisionRecord[] revisions) : IReportRevisionStore
    {
        public Task<ReportRequestRecord> AddReportRequestAsync(ReportRequestRecord request, CancellationToken cancellationToken) => throw new NotSupportedException();

        public Task<IReadOnlyList<ReportRequestRecord>> GetPendingReportRequestsAsync(string wafer, CancellationToken cancellationToken) => throw new NotSupportedException();

        public Task<ReportRevisionRecord?> AddReportRevisionAsync(ReportRevisionRecord revision, IReadOnlyList<long> answeredRequestIds, CancellationToken cancellationToken) =>
            throw new NotSupportedException();

        public Task<IReadOnlyList<ReportRevisionRecord>> GetReportRevisionsAsync(string wafer, CancellationToken cancellationToken) =>
            Task.FromResult<IReadOnlyList<ReportRevisionRecord>>(revisions.Where(r => r.Wafer == wafer).ToArray());

        public Task<ReportRevisionRecord?> FindReportRevisionAsync(string contentSha256, CancellationToken cancellationToken) =>
            Task.FromResult(revisions.FirstOrDefault(r => r.ContentSha256 == contentSha256));
    }
}
