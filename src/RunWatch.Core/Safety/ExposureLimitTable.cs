namespace RunWatch.Core.Safety;

/// <summary>
/// The one table of exposure limits the dashboard may show. Every value here is confirmed against the named
/// source; limits are revised, so the screen always shows the source, the edition and the disclaimer.
/// </summary>
public static class ExposureLimitTable
{
    /// <summary>Molar mass of arsine, AsH₃, in g/mol (As 74.9216 + 3 × H 1.008).</summary>
    public const double ArsineMolarMass = 77.95;

    private const string ArsineIdlhDoc = "NIOSH, Immediately Dangerous to Life or Health documentation for arsine (CAS 7784-42-1)";
    private const string ArsenicIdlhDoc = "NIOSH, Immediately Dangerous to Life or Health documentation for inorganic arsenic (CAS 7440-38-2)";

    /// <summary>The disclaimer shown wherever limits or reminders are shown.</summary>
    public const string Disclaimer =
        "These reminders are for information only. They do not replace hardware interlocks, toxic-gas detection and " +
        "alarm systems, your site's safety procedures, training and permits, or the codes and regulations that apply " +
        "where you work. Exposure limits are shown as published by the named body in the edition given; check the " +
        "current edition.";

    /// <summary>All limits, in display order.</summary>
    public static IReadOnlyList<ExposureLimit> All { get; } =
    [
        new("Arsine", "OSHA", "PEL", 0.05, "ppm", "8-h TWA", ArsineIdlhDoc + ", citing 29 CFR 1910.1000", "1994"),
        new("Arsine", "NIOSH", "REL", 0.002, "mg/m³", "ceiling, 15 min", ArsineIdlhDoc, "1994",
            "NIOSH lists arsine as a potential occupational carcinogen (Ca)."),
        new("Arsine", "NIOSH", "IDLH", 3, "ppm", "IDLH", ArsineIdlhDoc, "1994", "Revised value; the original was 6 ppm."),
        new("Arsine", "ACGIH", "TLV", 0.05, "ppm", "8-h TWA", ArsineIdlhDoc + ", citing the ACGIH 1993–94 TLV booklet", "1993–94",
            "Historical edition. ACGIH revises its TLVs: check the current booklet."),
        new("Inorganic arsenic (as As)", "OSHA", "PEL", 0.010, "mg/m³", "8-h TWA", ArsenicIdlhDoc + ", citing 29 CFR 1910.1018", "1994"),
        new("Inorganic arsenic (as As)", "OSHA", "action level", 0.005, "mg/m³", "8-h TWA", ArsenicIdlhDoc + ", citing 29 CFR 1910.1018", "1994"),
        new("Inorganic arsenic (as As)", "NIOSH", "REL", 0.002, "mg/m³", "ceiling, 15 min", ArsenicIdlhDoc, "1994",
            "NIOSH lists inorganic arsenic as a potential occupational carcinogen (Ca)."),
        new("Inorganic arsenic (as As)", "NIOSH", "IDLH", 5, "mg/m³", "IDLH", ArsenicIdlhDoc, "1994"),
    ];
}
