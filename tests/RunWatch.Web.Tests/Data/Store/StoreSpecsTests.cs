using RunWatch.Core.Qc;
using RunWatch.Web.Data;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Data.Store;

/// <summary>QC specifications and the audit log through the dashboard's store-backed data, on a real SQLite file.</summary>
public sealed class StoreSpecsTests : IDisposable
{
    private readonly StoreHarness _harness = new();

    public void Dispose() => _harness.Dispose();

    private async Task<SpecEntry> RowAsync(string name) =>
        (await _harness.Data.GetSpecsAsync(CancellationToken.None)).Single(s => s.Recipe == "nw-inv" && s.Name == name);

    [Fact]
    public async Task GetSpecsAsync_FreshStore_ShowsConfigurationAsRows()
    {
        SpecEntry mean = await RowAsync("mean radius");
        SpecEntry cv = await RowAsync("radius CV");

        // 45 ± 10 nm fail, ± 5 nm warn (DERIVED: window = target ± tolerance).
        Assert.Equal((35.0, 55.0, 40.0, 50.0), (mean.Min!.Value, mean.Max!.Value, mean.WarnMin!.Value, mean.WarnMax!.Value));
        Assert.Equal("nm", mean.Unit);
        Assert.Equal(SpecSides.Upper, cv.Sides);
        Assert.Equal(0.35, cv.Max);
        Assert.Null(cv.Min);
    }

    [Fact]
    public async Task UpdateSpecAsync_AdminEdit_StoredAuditedAndKeptAcrossRestart()
    {
        SpecEntry mean = await RowAsync("mean radius");

        await _harness.Data.UpdateSpecAsync(mean with { Min = 25, Max = 35, WarnMin = 27, WarnMax = 33 }, "ada-admin", CancellationToken.None);
        _harness.Reopen();

        QcSpecification inForce = await _harness.Catalog.SpecificationForAsync("nw-inv", CancellationToken.None);
        Assert.Equal(30, inForce.TargetMeanRadiusNm);
        Assert.Equal(5, inForce.MeanRadiusToleranceNm);
        Assert.Equal(3, inForce.MeanRadiusWarnToleranceNm!.Value, 1e-12);
        Assert.Equal(0.35, inForce.MaxRadiusCv); // other rules untouched
        AuditEntry entry = (await _harness.Data.GetAuditAsync(20, CancellationToken.None)).First(a => a.Action == "spec edited");
        Assert.Equal("ada-admin", entry.User);
        Assert.Equal("spec nw-inv", entry.Subject);
        Assert.Equal("recipe nw-inv, mean radius: 35…55 (warn 40…50) → 25…35 (warn 27…33) nm", entry.Detail);
    }

    public static TheoryData<string, double?, double?, double?, double?, string, string> InvalidEdits => new()
    {
        { "mean radius", 50, 40, null, null, "nm", "must be below the upper" },
        { "mean radius", double.NaN, 40, null, null, "nm", "finite" },
        { "mean radius", 35, double.PositiveInfinity, null, null, "nm", "finite" },
        { "mean radius", 35, 55, 41, 50, "nm", "centred on the same target" },
        { "mean radius", 35, 55, null, null, "µm", "set in nm, not µm" },
        { "radius CV", 0.1, 0.35, null, null, "fraction", "upper limit only" },
        { "radius CV", null, 0.35, null, 0.4, "fraction", "WarnRadiusCv" },
        { "vertical yield", 1.5, null, null, null, "fraction", "fraction in [0, 1]" },
        { "wire count", 12.5, null, null, null, "wires", "whole number" },
        { "wire count", 10, 20, null, null, "wires", "lower limit only" },
        { "wire count", 10, null, 20, null, "wires", "no warn limit" },
    };

    [Theory]
    [MemberData(nameof(InvalidEdits))]
    public async Task UpdateSpecAsync_InvalidEdit_RefusedWithReasonAndNothingChanged(string name, double? min, double? max, double? warnMin, double? warnMax, string unit, string reason)
    {
        SpecEntry row = await RowAsync(name);
        var before = await _harness.Data.GetSpecsAsync(CancellationToken.None);

        var ex = await Assert.ThrowsAsync<ArgumentException>(() =>
            _harness.Data.UpdateSpecAsync(row with { Min = min, Max = max, WarnMin = warnMin, WarnMax = warnMax, Unit = unit }, "ada-admin", CancellationToken.None));

        Assert.Contains(reason, ex.Message, StringComparison.Ordinal);
        Assert.StartsWith("Not saved", ex.Message, StringComparison.Ordinal);
        Assert.Equal(before, await _harness.Data.GetSpecsAsync(CancellationToken.None));
        Assert.DoesNotContain(await _harness.Data.GetAuditAsync(20, CancellationToken.None), a => a.Action == "spec edited");
    }

    [Fact]
    public async Task UpdateSpecAsync_UnknownRecipe_ThrowsKeyNotFound()
    {
        SpecEntry row = await RowAsync("radius CV");

        await Assert.ThrowsAsync<KeyNotFoundException>(() => _harness.Data.UpdateSpecAsync(row with { Recipe = "nw-none" }, "ada-admin", CancellationToken.None));
    }

    [Fact]
    public async Task GetAuditAsync_AfterActions_ReadsStoredEntriesNewestFirst()
    {
        await _harness.Data.RecordAuditAsync(new AuditEntry(DateTimeOffset.UtcNow.AddMinutes(-1), "eng1", "alert acknowledged (comment)", "alert 7", "checked the thermocouple"),
            CancellationToken.None);
        await _harness.Data.UpdateSpecAsync((await RowAsync("radius CV")) with { Max = 0.4 }, "ada-admin", CancellationToken.None);

        var audit = await _harness.Data.GetAuditAsync(10, CancellationToken.None);

        Assert.Equal("spec edited", audit[0].Action);
        Assert.Contains(audit, a => a.User == "eng1" && a.Detail == "checked the thermocouple" && a.Subject == "alert 7");
        Assert.Contains(audit, a => a.Action == "spec seeded" && a.User == "configuration");
    }
}
