using Microsoft.Extensions.DependencyInjection;
using RunWatch.Testing.Dashboard;
using RunWatch.Web.Safety;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Safety;

/// <summary>The audit log is not flooded by "reminder shown": one entry per user per stretch in which a reminder holds.</summary>
public sealed class ReminderMonitorAuditTests
{
    private const string Rule = "arsenic-source-hot"; // 150 °C on the arsenic cell (DefaultReminders)

    [Fact]
    public async Task RecordShownAsync_ReadingFlappingAtThreshold_OneEntryPerUserUntilClearForRearmTime()
    {
        using var ctx = new DashboardTestContext();
        var monitor = ctx.Services.GetRequiredService<ReminderMonitor>();
        string[] users = ["ada-engineer", "bo-viewer"];

        // Five minutes of a reading that crosses the threshold every 5 s (noise on a cell held near 150 °C), two users watching.
        for (int step = 0; step < 60; step++)
        {
            await ShowAsync(ctx, monitor, step % 2 == 0 ? 152 : 148, users);
            ctx.Time.Advance(TimeSpan.FromSeconds(5));
        }
        int afterFlapping = await ShownCountAsync(ctx);

        // Clear for longer than the re-arm time, then above again: a new stretch, logged once more per user.
        for (int step = 0; step < 24; step++)
        {
            await ShowAsync(ctx, monitor, 120, users);
            ctx.Time.Advance(TimeSpan.FromSeconds(30));
        }
        Assert.True(TimeSpan.FromSeconds(24 * 30) > ReminderMonitor.RearmAfter);
        for (int step = 0; step < 10; step++)
        {
            await ShowAsync(ctx, monitor, 160, users);
            ctx.Time.Advance(TimeSpan.FromSeconds(5));
        }

        Assert.Equal(2, afterFlapping);
        Assert.Equal(4, await ShownCountAsync(ctx));
    }

    private static async Task ShowAsync(DashboardTestContext ctx, ReminderMonitor monitor, double celsius, string[] users)
    {
        ctx.Data.AddSamples(InventedLabScenario.GrowingChamber, "as_cell_tc", ctx.Time.GetUtcNow(), celsius);
        var chamber = (await ctx.Data.GetChamberAsync(InventedLabScenario.GrowingChamber, CancellationToken.None))!;
        var active = monitor.Evaluate(chamber).Where(r => r.Rule.Id == Rule).ToList();
        Assert.Equal(celsius > 150, active.Count == 1);
        foreach (string user in users)
        {
            await monitor.RecordShownAsync(active, user, CancellationToken.None);
        }
    }

    private static async Task<int> ShownCountAsync(DashboardTestContext ctx) =>
        (await ctx.Data.GetAuditAsync(1000, CancellationToken.None)).Count(a => a.Action == "reminder shown" && a.Subject.EndsWith(Rule, StringComparison.Ordinal));
}
