namespace RunWatch.Storage.Tests.Contract;

/// <summary>The <see cref="IReminderBindingStore"/> contract on SQLite and PostgreSQL: each change with its audit entry, kept across a reopen.</summary>
public sealed class ReminderBindingStoreContractTests
{
    private static readonly DateTimeOffset T0 = new(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);

    [Theory]
    [AllStores]
    public async Task SaveReminderBindingAsync_ReplaceAndRemove_ReadsLatestWithOneAuditEach(StoreKind kind)
    {
        await using var db = await StoreUnderTest.CreateAsync(kind);
        await db.Store.MigrateAsync(CancellationToken.None);

        await db.ReminderBindings.SaveReminderBindingAsync(new ReminderBinding("mbe-2", "group-v-source", "as_bep", T0, "ada-admin"),
            new AuditEntry(T0, "ada-admin", "reminder bound", "mbe-2 group-v-source", AuditDetail.Json("as_bep")), CancellationToken.None);
        await db.ReminderBindings.SaveReminderBindingAsync(new ReminderBinding("mbe-2", "group-v-source", null, T0.AddMinutes(1), "ada-admin"),
            new AuditEntry(T0.AddMinutes(1), "ada-admin", "reminder bound", "mbe-2 group-v-source", AuditDetail.Json("none")), CancellationToken.None);
        await db.ReminderBindings.SaveReminderBindingAsync(new ReminderBinding("mbe-1", "cryo-fill", "ln2_level", T0.AddMinutes(2), "bo-admin"),
            new AuditEntry(T0.AddMinutes(2), "bo-admin", "reminder bound", "mbe-1 cryo-fill", AuditDetail.Json("ln2_level")), CancellationToken.None);
        await db.ReopenAsync();
        var bindings = await db.ReminderBindings.GetReminderBindingsAsync(CancellationToken.None);
        bool removed = await db.ReminderBindings.RemoveReminderBindingAsync("mbe-1", "cryo-fill",
            new AuditEntry(T0.AddMinutes(3), "bo-admin", "reminder unbound", "mbe-1 cryo-fill", null), CancellationToken.None);
        bool removedAgain = await db.ReminderBindings.RemoveReminderBindingAsync("mbe-1", "cryo-fill",
            new AuditEntry(T0.AddMinutes(4), "bo-admin", "reminder unbound", "mbe-1 cryo-fill", null), CancellationToken.None);
        var after = await db.ReminderBindings.GetReminderBindingsAsync(CancellationToken.None);
        var audit = await db.Store.GetAuditAsync(10, CancellationToken.None);

        Assert.Equal(2, bindings.Count);
        Assert.Equal(("mbe-1", "cryo-fill", "ln2_level"), (bindings[0].Chamber, bindings[0].Role, bindings[0].Channel));
        Assert.Equal(("mbe-2", "group-v-source"), (bindings[1].Chamber, bindings[1].Role));
        Assert.Null(bindings[1].Channel); // bound to no channel: not watched, said so on the screens
        Assert.Equal(T0.AddMinutes(1), bindings[1].UpdatedAt);
        Assert.True(removed);
        Assert.False(removedAgain); // nothing to remove writes no audit entry
        Assert.Single(after);
        Assert.Equal(4, audit.Count);
        Assert.Equal("reminder unbound", audit[0].Action);
    }
}
