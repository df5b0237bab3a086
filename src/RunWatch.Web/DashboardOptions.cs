using System.ComponentModel.DataAnnotations;
using RunWatch.Web.Security;

namespace RunWatch.Web;

/// <summary>Dashboard settings, bound from the configuration section <c>RunWatch:Dashboard</c>.</summary>
public sealed class DashboardOptions
{
    public const string SectionName = "RunWatch:Dashboard";

    /// <summary>Users allowed to log in. Serve mode creates none by default.</summary>
    public List<ConfiguredUser> Users { get; set; } = [];

    /// <summary>IANA or Windows time-zone id for displayed times; empty means the machine's local zone.</summary>
    public string TimeZone { get; set; } = "";

    /// <summary>
    /// A note shown at the top of every screen when set: the demo sets it to say that its data are invented and its
    /// clock accelerated. Empty (the default) shows nothing.
    /// </summary>
    public string DataNote { get; set; } = "";

    /// <summary>Most points any chart ships to the browser.</summary>
    /// <value>5000.</value>
    [Range(100, 50_000)]
    public int MaxChartPoints { get; set; } = 5000;

    /// <summary>Span of the chamber page's live chart.</summary>
    /// <value>30 minutes.</value>
    public TimeSpan LiveWindow { get; set; } = TimeSpan.FromMinutes(30);

    /// <summary>Shortest interval between two redraws of one live chart.</summary>
    /// <value>250 ms.</value>
    public TimeSpan LiveRedrawInterval { get; set; } = TimeSpan.FromMilliseconds(250);

    /// <summary>Deviation from setpoint at which the chart's warning band ends, in kelvin, where the host gives no
    /// chamber bands (serve and demo draw each chamber's own alert bands from its Excursions configuration).</summary>
    /// <value>3 K.</value>
    public double WarningBandK { get; set; } = 3;

    /// <summary>Deviation from setpoint at which the chart's alarm band ends, in kelvin, where the host gives no chamber bands.</summary>
    /// <value>8 K.</value>
    public double AlarmBandK { get; set; } = 8;

    /// <summary>Parameters of the planner's built-in model.</summary>
    public PlannerOptions Planner { get; set; } = new();

    /// <summary>
    /// Reminder thresholds that replace the built-in defaults: rule id → threshold in the rule's unit (docs/safety.md).
    /// They are the defaults seeded into the store on first start; afterwards admins edit the stored value.
    /// </summary>
    public Dictionary<string, double> ReminderThresholds { get; set; } = new(StringComparer.Ordinal);

    /// <summary>
    /// A channel a reminder reads whose latest sample is older than this makes the reminder "not watched on this
    /// chamber" (a channel that publishes only on change must also publish periodically to stay watched).
    /// </summary>
    /// <value>60 s.</value>
    public TimeSpan ReminderChannelStaleAfter { get; set; } = TimeSpan.FromSeconds(60);

    /// <summary>Longest shelving an engineer may choose.</summary>
    /// <value>24 hours.</value>
    public TimeSpan MaxShelveDuration { get; set; } = TimeSpan.FromHours(24);

    /// <summary>
    /// Origins (<c>scheme://host[:port]</c>) besides the dashboard's own from which a browser may send state-changing
    /// requests, e.g. the public name a reverse proxy serves it under when the proxy rewrites the Host header.
    /// </summary>
    public List<string> AllowedOrigins { get; set; } = [];

    /// <summary>Login attempts one client address may make per <see cref="LoginWindow"/>; more get 429.</summary>
    /// <value>20.</value>
    [Range(1, 10_000)]
    public int LoginAttemptsPerAddress { get; set; } = 20;

    /// <summary>Login attempts for one user name (whatever the address) per <see cref="LoginWindow"/>; more get 429.</summary>
    /// <value>5.</value>
    [Range(1, 10_000)]
    public int LoginAttemptsPerUser { get; set; } = 5;

    /// <summary>The window the login limits count in.</summary>
    /// <value>1 minute.</value>
    public TimeSpan LoginWindow { get; set; } = TimeSpan.FromMinutes(1);
}
