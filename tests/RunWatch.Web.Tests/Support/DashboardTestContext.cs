using Bunit;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Options;
using Microsoft.Extensions.Time.Testing;
using RunWatch.Core.Safety;
using RunWatch.Web;
using RunWatch.Web.Data;
using RunWatch.Testing.Dashboard;
using RunWatch.Web.Live;
using RunWatch.Web.Safety;

namespace RunWatch.Web.Tests.Support;

/// <summary>A bUnit context with the dashboard's services over an in-memory source and a fake clock.</summary>
internal sealed class DashboardTestContext : BunitContext
{
    /// <summary>Report revisions for the wafer page (none kept unless a store is given).</summary>
    public RunWatch.Web.Records.ReportRevisionQueries Revisions { get; }

    public static readonly DateTimeOffset Now = new(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);

    public DashboardTestContext(string role = "engineer", bool seed = true, RunWatch.Storage.IReportRevisionStore? revisions = null)
    {
        Revisions = new RunWatch.Web.Records.ReportRevisionQueries(revisions);
        Time = new FakeTimeProvider(Now);
        Data = new InMemoryDashboardData(Time);
        if (seed)
        {
            InventedLabScenario.Seed(Data, Now);
        }
        Hub = new LiveUpdateHub(NullLogger<LiveUpdateHub>.Instance);
        Services.AddSingleton<TimeProvider>(Time);
        Services.AddSingleton<IDashboardQueries>(Data);
        Services.AddSingleton<IDashboardCommands>(Data);
        Services.AddSingleton<ILabRecordQueries>(Records);
        Services.AddSingleton<IPlannerEngine>(new RunWatch.Web.Data.Store.ProcessModelPlanner(Microsoft.Extensions.Options.Options.Create(new RunWatch.Web.DashboardOptions())));
        Services.AddSingleton(Hub);
        Services.AddSingleton<ITelemetryNotifier>(Hub);
        Services.AddSingleton<IOptions<DashboardOptions>>(Options.Create(new DashboardOptions { TimeZone = "UTC" }));
        Services.AddSingleton<DashboardClock>();
        Services.AddSingleton(new ReminderRuleSet(DefaultReminders.All));
        Services.AddSingleton<ReminderBindings>();
        Services.AddSingleton<ReminderMonitor>();
        Services.AddSingleton<ReminderRuleEditor>();
        Services.AddSingleton(Revisions);
        Services.AddSingleton(new RunWatch.Web.Security.UserDirectory());
        Services.AddSingleton<IConfiguration>(new ConfigurationBuilder().AddInMemoryCollection(new Dictionary<string, string?>
        {
            ["RunWatch:Dashboard:MaxChartPoints"] = "5000",
            ["RunWatch:Dashboard:Users:0:PasswordHash"] = "AQAAAAIAAYagAAAAEsecret",
        }).Build());
        JSInterop.Mode = JSRuntimeMode.Loose;
        var auth = AddAuthorization();
        auth.SetAuthorized("test-" + role);
        auth.SetRoles(role);
    }

    public FakeTimeProvider Time { get; }

    public InMemoryDashboardData Data { get; }

    public InMemoryLabRecords Records { get; } = new();

    public LiveUpdateHub Hub { get; }
}
