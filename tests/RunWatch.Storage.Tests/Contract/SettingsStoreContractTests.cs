using RunWatch.Core.Qc;

namespace RunWatch.Storage.Tests.Contract;

/// <summary>
/// The <see cref="ISettingsStore"/> contract and audit reads, across a reopen of the store: every test body runs
/// against SQLite and PostgreSQL.
/// </summary>
public sealed class SettingsStoreContractTests
{
    private static readonly DateTimeOffset T0 = new(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);

    private static QcSpecification Spec(double target, double tolerance) =>
        new() { TargetMeanRadiusNm = target, MeanRadiusToleranceNm = tolerance, MaxRadiusCv = 0.3, WarnRadiusCv = 0.2, MinWireCount = 40, MissingValueOutcome = QcOutcome.Fail };

    [Theory]
    [AllStores]
    public async Task SaveQcSpecificationAsync_AfterReopen_ReadsEditedValueAndAudit(StoreKind kind)
    {
        await using var db = await StoreUnderTest.CreateAsync(kind);
        await db.Store.MigrateAsync(CancellationToken.None);
        int seeded = await db.Settings.SeedQcSpecificationsAsync(new Dictionary<string, QcSpecification> { ["nw-a"] = Spec(45, 10), [""] = Spec(50, 20) },
            "configuration", T0, CancellationToken.None);
        await db.Settings.SaveQcSpecificationAsync("nw-a", Spec(40, 4), "ada-admin",
            new AuditEntry(T0.AddMinutes(1), "ada-admin", "spec edited", "spec nw-a", AuditDetail.Json("target 45 → 40 nm")), null, CancellationToken.None);

        // A second store on the same file, as after a restart.
        await db.ReopenAsync();
        await db.Store.MigrateAsync(CancellationToken.None);
        int seededAgain = await db.Settings.SeedQcSpecificationsAsync(new Dictionary<string, QcSpecification> { ["nw-a"] = Spec(45, 10) },
            "configuration", T0.AddMinutes(2), CancellationToken.None);
        var specs = await db.Settings.GetQcSpecificationsAsync(CancellationToken.None);
        var audit = await db.Store.GetAuditAsync(10, CancellationToken.None);

        Assert.Equal(2, seeded);
        Assert.Equal(0, seededAgain); // seeding never overwrites a stored value
        Assert.Equal(["", "nw-a"], specs.Select(s => s.Recipe));
        var edited = specs[1];
        Assert.Equal(40, edited.Specification.TargetMeanRadiusNm);
        Assert.Equal(4, edited.Specification.MeanRadiusToleranceNm);
        Assert.Equal(0.2, edited.Specification.WarnRadiusCv);
        Assert.Equal(QcOutcome.Fail, edited.Specification.MissingValueOutcome);
        Assert.Null(edited.Specification.MinDensityPerCm2);
        Assert.Equal("ada-admin", edited.UpdatedBy);
        Assert.Equal(T0.AddMinutes(1), edited.UpdatedAt);
        Assert.Equal(3, audit.Count);
        Assert.Equal("spec edited", audit[0].Action);
        Assert.Equal("ada-admin", audit[0].Actor);
        Assert.Equal("target 45 → 40 nm", AuditDetail.Text(audit[0].DetailJson));
        Assert.All(audit.Skip(1), a => Assert.Equal("spec seeded", a.Action));
    }

    [Theory]
    [AllStores]
    public async Task SaveQcSpecificationAsync_UnknownRecipe_ThrowsAndWritesNoAudit(StoreKind kind)
    {
        await using var db = await StoreUnderTest.CreateAsync(kind);
        await db.Store.MigrateAsync(CancellationToken.None);

        await Assert.ThrowsAsync<KeyNotFoundException>(() => db.Settings.SaveQcSpecificationAsync("nope", Spec(40, 4), "ada-admin",
            new AuditEntry(T0, "ada-admin", "spec edited", "spec nope", null), null, CancellationToken.None));

        Assert.Equal(0, await db.CountAsync("SELECT COUNT(*) FROM audit_entries"));
        Assert.Equal(0, await db.CountAsync("SELECT COUNT(*) FROM qc_specifications"));
    }

    [Theory]
    [AllStores]
    public async Task SaveQcSpecificationAsync_RowChangedSinceRead_RefusedAndNothingWritten(StoreKind kind)
    {
        await using var db = await StoreUnderTest.CreateAsync(kind);
        await db.Store.MigrateAsync(CancellationToken.None);
        await db.Settings.SeedQcSpecificationsAsync(new Dictionary<string, QcSpecification> { ["nw-a"] = Spec(45, 10) }, "configuration", T0, CancellationToken.None);
        DateTimeOffset read = (await db.Settings.GetQcSpecificationsAsync(CancellationToken.None))[0].UpdatedAt;
        // Another admin saves first.
        await db.Settings.SaveQcSpecificationAsync("nw-a", Spec(40, 4), "bea-admin", new AuditEntry(T0.AddMinutes(1), "bea-admin", "spec edited", "spec nw-a", null), read,
            CancellationToken.None);

        var ex = await Assert.ThrowsAsync<InvalidOperationException>(() => db.Settings.SaveQcSpecificationAsync("nw-a", Spec(50, 2), "ada-admin",
            new AuditEntry(T0.AddMinutes(2), "ada-admin", "spec edited", "spec nw-a", null), read, CancellationToken.None));

        Assert.Contains("changed meanwhile by bea-admin", ex.Message, StringComparison.Ordinal);
        Assert.Equal(40, (await db.Settings.GetQcSpecificationsAsync(CancellationToken.None))[0].Specification.TargetMeanRadiusNm);
        Assert.Equal(1, await db.CountAsync("SELECT COUNT(*) FROM audit_entries WHERE action = 'spec edited'"));
    }

    [Theory]
    [AllStores]
    public async Task SaveReminderSettingAsync_AfterReopen_ReadsEditedThresholdAndAudit(StoreKind kind)
    {
        await using var db = await StoreUnderTest.CreateAsync(kind);
        await db.Store.MigrateAsync(CancellationToken.None);
        var defaults = new List<ReminderSetting>
        {
            new("substrate-above-vent-limit", 200, "°C", TimeSpan.Zero, T0, "configuration"),
            new("telemetry-stale", 0, "", TimeSpan.FromSeconds(30), T0, "configuration"),
        };
        int seeded = await db.Settings.SeedReminderSettingsAsync(defaults, CancellationToken.None);
        await db.Settings.SaveReminderSettingAsync(defaults[0] with { Threshold = 150, UpdatedAt = T0.AddMinutes(5), UpdatedBy = "ada-admin" },
            new AuditEntry(T0.AddMinutes(5), "ada-admin", "reminder edited", "substrate-above-vent-limit", AuditDetail.Json("threshold 200 → 150 °C")),
            CancellationToken.None);

        await db.ReopenAsync();
        int seededAgain = await db.Settings.SeedReminderSettingsAsync(defaults, CancellationToken.None);
        var settings = await db.Settings.GetReminderSettingsAsync(CancellationToken.None);
        var audit = await db.Store.GetAuditAsync(10, CancellationToken.None);

        Assert.Equal(2, seeded);
        Assert.Equal(0, seededAgain);
        Assert.Equal(150, settings.Single(s => s.RuleId == "substrate-above-vent-limit").Threshold);
        Assert.Equal("ada-admin", settings.Single(s => s.RuleId == "substrate-above-vent-limit").UpdatedBy);
        Assert.Equal(TimeSpan.FromSeconds(30), settings.Single(s => s.RuleId == "telemetry-stale").Window);
        Assert.Equal("reminder edited", Assert.Single(audit).Action);
    }

    [Theory]
    [AllStores]
    public async Task GetAuditAsync_ManyEntries_NewestFirstAndBounded(StoreKind kind)
    {
        await using var db = await StoreUnderTest.CreateAsync(kind);
        await db.Store.MigrateAsync(CancellationToken.None);
        for (int i = 0; i < 5; i++)
        {
            await db.Store.AppendAuditAsync(new AuditEntry(T0.AddSeconds(i), "user" + i, "alert acknowledged", "alert " + i, null), CancellationToken.None);
        }

        var audit = await db.Store.GetAuditAsync(3, CancellationToken.None);

        Assert.Equal(["user4", "user3", "user2"], audit.Select(a => a.Actor));
        Assert.Equal(T0.AddSeconds(4), audit[0].At);
        Assert.Null(audit[0].DetailJson);
    }
}
