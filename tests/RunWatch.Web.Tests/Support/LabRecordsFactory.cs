using RunWatch.Core.Qc;
using RunWatch.Core.Wafers;
using RunWatch.Storage;
using RunWatch.Testing.Dashboard;
using RunWatch.Web.Data;

namespace RunWatch.Web.Tests.Support;

/// <summary>Invented fields, wafers and runs for the lab-record screens (no real data).</summary>
internal static class LabRecordsFactory
{
    /// <summary>Analysed area of every invented field: 6 × 4 µm = 0.24 × 10⁻⁶ cm².</summary>
    public const double AreaCm2 = 6000e-7 * 4000e-7;

    /// <summary>A field whose counted wires have exactly these radii (vertical, interior), plus one tilted object.</summary>
    public static FieldResult Field(string name, params double[] radii)
    {
        var wires = new List<FieldWire>();
        for (int i = 0; i < radii.Length; i++)
        {
            wires.Add(new FieldWire(i + 1, 100 * i, 100, radii[i], true, true, 0.8));
        }
        wires.Add(new FieldWire(radii.Length + 1, 50, 50, 70, false, true, null));
        return new FieldResult
        {
            FieldName = name,
            PixelSizeNm = 4,
            WidthNm = 6000,
            AnalysedHeightNm = 4000,
            Threshold = "otsu",
            AnalysedAreaCm2 = AreaCm2,
            Wires = wires,
        };
    }

    public static QcSpecification Spec => new()
    {
        TargetMeanRadiusNm = 30,
        MeanRadiusToleranceNm = 8,
        MeanRadiusWarnToleranceNm = 3,
        MaxRadiusCv = 0.35,
        MinWireCount = 100,
    };

    /// <summary>A digest with only what the trends and the wafer list read.</summary>
    public static WaferReportDigest Digest(double meanNm, double cv, double densityPerCm2, double biasNm) =>
        new(new WireStatistics(200, meanNm, meanNm * cv, cv, meanNm, meanNm / 2, meanNm * 2, densityPerCm2, 0.95), null, null,
            new WaferAgreementDigest(150, biasNm, 2, 0.8, 1.5));

    /// <summary>Wafer W-MAP-1: fields at (−20, 0), (0, 0) and (10, 5) mm with means 28, 30 and 40 nm, and one field without a position.</summary>
    public static void SeedMap(InMemoryLabRecords records)
    {
        records.AddWafer(new InMemoryLabRecords.WaferEntry("W-MAP-1", "R-MAP", "north-1", "nw-inv", DashboardTestContext.Now, "WARN",
        [
            new LabRecordComposer.StoredField("11", "W-MAP-1_f1.png", -20, 0, Field("f1", 27, 29, 28)),
            new LabRecordComposer.StoredField("12", "W-MAP-1_f2.png", 0, 0, Field("f2", 29, 31, 30)),
            new LabRecordComposer.StoredField("13", "W-MAP-1_f3.png", 10, 5, Field("f3", 39, 41, 40)),
            new LabRecordComposer.StoredField("14", "W-MAP-1_f4.png", null, null, Field("f4", 30, 31)),
        ], Digest(31, 0.1, 1e9, 0.5), Spec));
    }
}
