using System.Globalization;
using RunWatch.Core.Qc;
using RunWatch.Storage;

namespace RunWatch.Web.Records;

/// <summary>
/// A wafer's report revisions for the wafer page, and what changed between two of them: the figures and the verdict
/// (from each revision's stored digest), the configuration, the model and the input images. Without a store that
/// keeps revisions (the in-memory dashboard) <see cref="Available"/> is false and the page says so.
/// </summary>
public sealed class ReportRevisionQueries(IReportRevisionStore? store = null)
{
    public bool Available => store is not null;

    /// <summary>The wafer's revisions, oldest first; empty without a store.</summary>
    public async Task<IReadOnlyList<ReportRevisionRecord>> ListAsync(string wafer, CancellationToken cancellationToken) =>
        store is null ? [] : await store.GetReportRevisionsAsync(wafer, cancellationToken).ConfigureAwait(false);

    /// <summary>Every compared figure of <paramref name="before"/> and <paramref name="after"/>, changed ones marked.</summary>
    public static IReadOnlyList<RevisionChange> Compare(ReportRevisionRecord before, ReportRevisionRecord after)
    {
        ArgumentNullException.ThrowIfNull(before);
        ArgumentNullException.ThrowIfNull(after);
        WaferReportDigest a = WaferReportDigestJson.Read(before.DigestJson);
        WaferReportDigest b = WaferReportDigestJson.Read(after.DigestJson);
        var rows = new List<RevisionChange>();
        void Add(string figure, string x, string y) => rows.Add(new RevisionChange(figure, x, y, !string.Equals(x, y, StringComparison.Ordinal)));

        Add("verdict", before.Verdict.ToUpperInvariant(), after.Verdict.ToUpperInvariant());
        Add("wires measured", Count(a.Statistics?.Count), Count(b.Statistics?.Count));
        Add("mean radius", Nm(a.Statistics?.MeanRadiusNm), Nm(b.Statistics?.MeanRadiusNm));
        Add("radius SD", Nm(a.Statistics?.RadiusSdNm), Nm(b.Statistics?.RadiusSdNm));
        Add("radius CV", Number(a.Statistics?.RadiusCv, "0.000"), Number(b.Statistics?.RadiusCv, "0.000"));
        Add("density", Density(a.Statistics?.DensityPerCm2), Density(b.Statistics?.DensityPerCm2));
        Add("predicted mean radius", Nm(a.Prediction?.MeanRadiusNm), Nm(b.Prediction?.MeanRadiusNm));
        Add("bias (predicted − measured)", Nm(a.Agreement?.BiasNm), Nm(b.Agreement?.BiasNm));
        Add("RMSE", Nm(a.Agreement?.RmseNm), Nm(b.Agreement?.RmseNm));
        Add("r²", Number(a.Agreement?.RSquared, "0.000"), Number(b.Agreement?.RSquared, "0.000"));
        foreach (string rule in RuleNames(a.Verdict, b.Verdict))
        {
            Add("rule: " + rule, Rule(a.Verdict, rule), Rule(b.Verdict, rule));
        }
        Add("radius model", before.ModelId, after.ModelId);
        Add("configuration and specification (SHA-256)", Short(before.ConfigSha256), Short(after.ConfigSha256));
        Add("input images", Inputs(before), Inputs(after));
        Add("software", before.SoftwareVersion, after.SoftwareVersion);
        return rows;
    }

    private static IEnumerable<string> RuleNames(QcVerdict? a, QcVerdict? b)
    {
        var names = new List<string>();
        foreach (QcRuleResult r in (a?.Rules ?? []).Concat(b?.Rules ?? []))
        {
            if (!names.Contains(r.Description))
            {
                names.Add(r.Description);
            }
        }
        return names;
    }

    private static string Rule(QcVerdict? verdict, string description)
    {
        QcRuleResult? rule = verdict?.Rules.FirstOrDefault(r => r.Description == description);
        if (rule is null)
        {
            return "—";
        }
        string measured = rule.Measured is { } m ? m.ToString(rule.Unit == "nm" ? "0.0" : "G4", CultureInfo.InvariantCulture) + (rule.Unit.Length > 0 ? " " + rule.Unit : "") : "not measured";
        string word = rule.Outcome switch { QcOutcome.Pass => "PASS", QcOutcome.Warn => "WARN", _ => "FAIL" };
        return word + " (" + measured + ")";
    }

    private static string Inputs(ReportRevisionRecord r) =>
        r.Inputs.Count.ToString(CultureInfo.InvariantCulture) + " (" + string.Join(", ", r.Inputs.Select(i => i.File + " " + Short(i.Sha256))) + ")";

    private static string Short(string sha) => sha.Length > 12 ? sha[..12] + "…" : sha;

    private static string Count(int? n) => n?.ToString(CultureInfo.InvariantCulture) ?? "—";

    private static string Nm(double? v) => Number(v, "0.0") is var t && t != "—" ? t + " nm" : t;

    private static string Density(double? perCm2) => perCm2 is { } d && double.IsFinite(d) ? (d * 1e-8).ToString("0.00", CultureInfo.InvariantCulture) + " µm⁻²" : "—";

    private static string Number(double? v, string format) => v is { } x && double.IsFinite(x) ? x.ToString(format, CultureInfo.InvariantCulture) : "—";
}
