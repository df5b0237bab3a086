namespace RunWatch.Reports;

/// <summary>Fixed wording that every report carries.</summary>
public static class ReportWording
{
    /// <summary>The caution footer, in full.</summary>
    public const string Caution =
        "Verdicts support, never replace, an engineer's review: check the images, the thermal record and the rules " +
        "before releasing or scrapping a wafer. This report is for information only. It does not replace hardware " +
        "interlocks, toxic-gas detection and alarm systems, your site's EHS procedures, training and permits, or the " +
        "codes and regulations that apply where you work. Handle wafers, chamber parts and arsenic-bearing deposits " +
        "only as your site's procedures require.";

    /// <summary>The one-line form printed on every PDF page.</summary>
    public const string CautionShort = "Verdicts support, never replace, an engineer's review. Not a safety device: site procedures and interlocks govern.";
}
