using System.Security.Claims;
using System.Text.Json.Serialization;
using System.Threading.RateLimiting;
using Microsoft.AspNetCore.Antiforgery;
using Microsoft.AspNetCore.Authentication;
using Microsoft.AspNetCore.Authentication.Cookies;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Http;
using Microsoft.AspNetCore.HttpOverrides;
using Microsoft.AspNetCore.RateLimiting;
using Microsoft.AspNetCore.Mvc;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.DependencyInjection.Extensions;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using RunWatch.Core.Safety;
using RunWatch.Storage;
using RunWatch.Web.Api;
using RunWatch.Web.Components;
using RunWatch.Web.Live;
using RunWatch.Web.Safety;
using RunWatch.Web.Security;

namespace RunWatch.Web.Hosting;

/// <summary>
/// Composition of the dashboard: <c>builder.AddRunWatchDashboard()</c> before Build, <c>app.MapRunWatchDashboard()</c>
/// after. The host must also register <see cref="Data.IDashboardQueries"/>, <see cref="Data.IDashboardCommands"/>
/// and <see cref="Data.IPlannerEngine"/>.
/// </summary>
public static partial class DashboardHostingExtensions
{
    /// <summary>Default address: loopback only.</summary>
    public const string DefaultUrl = "http://127.0.0.1:5080";

    /// <summary>Registers the dashboard's services, authentication and options (section RunWatch:Dashboard).</summary>
    public static WebApplicationBuilder AddRunWatchDashboard(this WebApplicationBuilder builder)
    {
        ArgumentNullException.ThrowIfNull(builder);
        if (string.IsNullOrEmpty(builder.Configuration["urls"]) && string.IsNullOrEmpty(builder.Configuration["ASPNETCORE_URLS"]))
        {
            builder.WebHost.UseUrls(DefaultUrl);
        }
        var services = builder.Services;
        services.AddOptions<DashboardOptions>().Bind(builder.Configuration.GetSection(DashboardOptions.SectionName))
            .ValidateDataAnnotations()
            .ValidateErrorList(DashboardOptions.SectionName, o => ReminderRuleSet.Check(DefaultReminders.All, o.ReminderThresholds))
            .ValidateOnStart();
        services.TryAddSingleton(TimeProvider.System);
        services.TryAddSingleton<DashboardClock>();
        services.TryAddSingleton<LiveUpdateHub>();
        services.TryAddSingleton<ITelemetryNotifier>(sp => sp.GetRequiredService<LiveUpdateHub>());
        services.TryAddSingleton(sp => ReminderRuleSet.WithThresholds(DefaultReminders.All, sp.GetRequiredService<IOptions<DashboardOptions>>().Value.ReminderThresholds));
        services.TryAddSingleton<ReminderBindings>();
        services.TryAddSingleton<ReminderMonitor>();
        services.TryAddSingleton<ReminderRuleEditor>();
        services.TryAddSingleton<Records.ReportRevisionQueries>();
        services.AddHealthChecks().AddCheck<ReminderCoverageHealthCheck>("reminders");
        services.TryAddSingleton(sp =>
        {
            var directory = new UserDirectory();
            foreach (var user in sp.GetRequiredService<IOptions<DashboardOptions>>().Value.Users)
            {
                directory.Add(new DashboardUser(user.Name, user.Role, user.PasswordHash));
            }
            return directory;
        });

        services.AddRazorComponents().AddInteractiveServerComponents();
        services.AddCascadingAuthenticationState();
        services.AddAuthentication(CookieAuthenticationDefaults.AuthenticationScheme).AddCookie(options =>
        {
            options.LoginPath = "/login";
            options.LogoutPath = "/account/logout";
            options.AccessDeniedPath = "/login";
            options.Cookie.Name = "runwatch.auth";
            options.Cookie.HttpOnly = true;
            options.Cookie.SameSite = SameSiteMode.Strict;
            options.Cookie.SecurePolicy = CookieSecurePolicy.SameAsRequest;
            options.ExpireTimeSpan = TimeSpan.FromHours(12);
            options.SlidingExpiration = true;
            // The API answers 401/403 instead of redirecting to the login page.
            options.Events.OnRedirectToLogin = ctx => ApiOr(ctx, StatusCodes.Status401Unauthorized);
            options.Events.OnRedirectToAccessDenied = ctx => ApiOr(ctx, StatusCodes.Status403Forbidden);
        });
        services.AddAuthorizationBuilder()
            .AddPolicy(DashboardRoles.CanActPolicy, p => p.RequireRole(DashboardRoles.Engineer, DashboardRoles.Admin))
            .AddPolicy(DashboardRoles.AdminPolicy, p => p.RequireRole(DashboardRoles.Admin));
        // Behind a TLS proxy the request scheme comes from X-Forwarded-Proto (trusted from loopback proxies only, the
        // framework's default), so SameAsRequest marks both cookies Secure there.
        services.AddAntiforgery(o =>
        {
            o.Cookie.SecurePolicy = CookieSecurePolicy.SameAsRequest;
            o.Cookie.SameSite = SameSiteMode.Strict;
        });
        services.Configure<ForwardedHeadersOptions>(o => o.ForwardedHeaders = ForwardedHeaders.XForwardedFor | ForwardedHeaders.XForwardedProto);
        services.TryAddSingleton<LoginThrottle>();
        services.AddRateLimiter(o =>
        {
            o.RejectionStatusCode = StatusCodes.Status429TooManyRequests;
            o.OnRejected = (context, _) =>
            {
                context.HttpContext.Response.Headers.RetryAfter = ((int)Math.Ceiling(context.HttpContext.RequestServices
                    .GetRequiredService<IOptions<DashboardOptions>>().Value.LoginWindow.TotalSeconds)).ToString(System.Globalization.CultureInfo.InvariantCulture);
                return ValueTask.CompletedTask;
            };
            o.AddPolicy(LoginThrottle.AddressPolicy, http =>
            {
                var d = http.RequestServices.GetRequiredService<IOptions<DashboardOptions>>().Value;
                return RateLimitPartition.GetFixedWindowLimiter(http.Connection.RemoteIpAddress?.ToString() ?? "unknown", _ => new FixedWindowRateLimiterOptions
                {
                    PermitLimit = d.LoginAttemptsPerAddress,
                    Window = d.LoginWindow,
                    QueueLimit = 0,
                });
            });
        });
        services.ConfigureHttpJsonOptions(o =>
        {
            o.SerializerOptions.Converters.Add(new JsonStringEnumConverter());
            // A figure that was not measured is NaN; without this one such value turns the whole answer into a 500.
            o.SerializerOptions.NumberHandling = JsonNumberHandling.AllowNamedFloatingPointLiterals;
        });
        services.AddOpenApi("v1");
        return builder;
    }

    /// <summary>
    /// Registers the dashboard's data over the daemon's store: <see cref="Data.Store.StoreDashboardData"/> for the
    /// queries and commands (needs <see cref="Storage.IRunWatchStore"/> and <see cref="Storage.IAlertCommands"/>), the
    /// planner over the processes' accepted models (<see cref="Data.Store.ProcessModelPlanner"/>, falling back to
    /// RunWatch:Dashboard:Planner) and the diffusion-model planner (<see cref="Data.Store.StoreGrowthPlanner"/>) unless
    /// registered already, and the start-up load of stored settings.
    /// </summary>
    public static IServiceCollection AddRunWatchDashboardStoreData(this IServiceCollection services)
    {
        ArgumentNullException.ThrowIfNull(services);
        services.TryAddSingleton<Data.Store.StoreDashboardData>();
        services.TryAddSingleton<Data.IDashboardQueries>(sp => sp.GetRequiredService<Data.Store.StoreDashboardData>());
        services.TryAddSingleton<Data.IDashboardCommands>(sp => sp.GetRequiredService<Data.Store.StoreDashboardData>());
        services.TryAddSingleton<Data.IPlannerEngine, Data.Store.ProcessModelPlanner>();
        services.TryAddSingleton<Data.ILabRecordQueries, Data.Store.StoreLabRecords>();
        services.TryAddSingleton<Data.IGrowthPlanEngine, Data.Store.StoreGrowthPlanner>();
        services.AddHostedService<StoredSettingsStartupService>();
        return services;
    }

    /// <summary>Adds the middleware, the pages, the login endpoints, the REST API under /api and /openapi/v1.json.</summary>
    public static WebApplication MapRunWatchDashboard(this WebApplication app)
    {
        ArgumentNullException.ThrowIfNull(app);
        var users = app.Services.GetRequiredService<UserDirectory>();
        if (users.Count == 0)
        {
            LogNoUsers(app.Logger, DashboardOptions.SectionName);
        }
        app.UseForwardedHeaders();
        app.UseMiddleware<SecurityHeaders>();
        app.UseRateLimiter();
        app.UseAuthentication();
        app.UseAuthorization();
        // After authentication (an antiforgery token is bound to the signed-in user) and authorization (401 and 403
        // for the role come first and say more).
        app.UseMiddleware<SameOriginGuard>();
        app.UseAntiforgery();
        app.MapStaticAssets().AllowAnonymous();
        app.MapRazorComponents<App>().AddInteractiveServerRenderMode();
        MapAccount(app);
        app.MapDashboardApi();
        app.MapFieldViewerApi();
        app.MapOpenApi().RequireAuthorization();
        return app;
    }

    /// <summary>Demo mode only: creates one demo user per role with fresh random passwords and returns them to print.</summary>
    public static IReadOnlyList<DemoCredential> CreateRunWatchDemoUsers(this WebApplication app)
    {
        ArgumentNullException.ThrowIfNull(app);
        return app.Services.GetRequiredService<UserDirectory>().CreateDemoUsers();
    }

    private static void MapAccount(WebApplication app)
    {
        app.MapPost("/account/login", async (HttpContext http, UserDirectory users, LoginThrottle throttle, ILoggerFactory loggers,
            [FromForm] string username, [FromForm] string password, [FromForm] string? returnUrl) =>
        {
            var log = loggers.CreateLogger("RunWatch.Web.Login");
            if (returnUrl is { Length: > 0 } && !ReturnUrl.IsLocalPath(returnUrl))
            {
                return Results.Problem("returnUrl must be a path on this server without control characters", statusCode: StatusCodes.Status400BadRequest);
            }
            if (!throttle.TryAttempt(username))
            {
                LogLoginThrottled(log);
                http.Response.Headers.RetryAfter = ((int)Math.Ceiling(http.RequestServices.GetRequiredService<IOptions<DashboardOptions>>().Value.LoginWindow.TotalSeconds))
                    .ToString(System.Globalization.CultureInfo.InvariantCulture);
                return Results.Problem("Too many login attempts for this user name; wait and try again.", statusCode: StatusCodes.Status429TooManyRequests);
            }
            var user = users.Verify(username, password);
            if (user is null)
            {
                LogLoginRefused(log);
                return Results.Redirect("/login?error=1");
            }
            var identity = new ClaimsIdentity(
                [new Claim(ClaimTypes.Name, user.Name), new Claim(ClaimTypes.Role, user.Role)],
                CookieAuthenticationDefaults.AuthenticationScheme);
            await http.SignInAsync(CookieAuthenticationDefaults.AuthenticationScheme, new ClaimsPrincipal(identity));
            LogLoggedIn(log, user.Name, user.Role);
            return Results.LocalRedirect(returnUrl is { Length: > 0 } ? returnUrl : "/");
        }).AllowAnonymous().RequireRateLimiting(LoginThrottle.AddressPolicy);

        // The form carries its antiforgery token; an endpoint without form parameters is not checked by the
        // framework, so the check is explicit.
        app.MapPost("/account/logout", async (HttpContext http, IAntiforgery antiforgery) =>
        {
            if (!await antiforgery.IsRequestValidAsync(http))
            {
                return Results.Problem("Log out from the dashboard's own page (antiforgery token missing or invalid).", statusCode: StatusCodes.Status400BadRequest);
            }
            await http.SignOutAsync(CookieAuthenticationDefaults.AuthenticationScheme);
            return Results.Redirect("/login");
        }).AllowAnonymous();
    }

    private static Task ApiOr(RedirectContext<CookieAuthenticationOptions> context, int status)
    {
        if (context.Request.Path.StartsWithSegments("/api") || context.Request.Path.StartsWithSegments("/openapi"))
        {
            context.Response.StatusCode = status;
            return Task.CompletedTask;
        }
        context.Response.Redirect(context.RedirectUri);
        return Task.CompletedTask;
    }

    [LoggerMessage(EventId = 6010, Level = LogLevel.Warning, Message = "No dashboard users are configured (section {Section}:Users); nobody can log in until an administrator adds one")]
    private static partial void LogNoUsers(ILogger logger, string section);

    [LoggerMessage(EventId = 6011, Level = LogLevel.Information, Message = "Dashboard login refused")]
    private static partial void LogLoginRefused(ILogger logger);

    [LoggerMessage(EventId = 6013, Level = LogLevel.Warning, Message = "Dashboard login throttled (too many attempts for one user name)")]
    private static partial void LogLoginThrottled(ILogger logger);

    [LoggerMessage(EventId = 6012, Level = LogLevel.Information, Message = "Dashboard login: {User} ({Role})")]
    private static partial void LogLoggedIn(ILogger logger, string user, string role);
}
