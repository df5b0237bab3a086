using Microsoft.Extensions.DependencyInjection.Extensions;
using RunWatch.Ingest.Alerts;
using RunWatch.Ingest.Pipeline;
using RunWatch.Wafers.Pipeline;
using RunWatch.Web.Hosting;

namespace RunWatch.Hosting;

/// <summary>
/// The whole program in one host, shared by <c>serve</c> and <c>demo</c>: the daemon, the wafer pipeline and the
/// dashboard with its live push.
/// </summary>
internal static class RunWatchComposition
{
    public static WebApplicationBuilder AddRunWatch(this WebApplicationBuilder builder, string[] args)
    {
        builder.AddRunWatchDaemon(args);
        builder.Services.AddRunWatchWaferPipeline(builder.Configuration);
        builder.AddRunWatchDashboard();
        // Outside Development, ASP.NET Core serves static web assets only from a published wwwroot: a build run in
        // place (`dotnet run --project src/RunWatch -- demo`) would answer 200 with empty CSS and blazor.web.js, and
        // no page would become interactive. The manifest next to the build maps them; a published app has none, so
        // this is a no-op there.
        builder.WebHost.UseStaticWebAssets();
        // Wafer screens read the pipeline's tables; registered before the dashboard's adapter takes them up.
        builder.Services.TryAddSingleton<RunWatch.Web.Data.Store.StoreWaferData>();
        builder.Services.TryAddSingleton<RunWatch.Web.Data.IFieldAssigner, PipelineFieldAssigner>();
        builder.Services.TryAddSingleton<RunWatch.Web.Data.IModelRefitter, PipelineModelRefitter>();
        // Fields screen (upload, queue, re-analysis) and the full-field viewer.
        builder.Services.TryAddSingleton<RunWatch.Web.Data.Fields.IFieldPipeline, PipelineFieldUploads>();
        builder.Services.TryAddSingleton<RunWatch.Web.Data.Fields.IFieldImageRenderer, PipelineFieldImageRenderer>();
        builder.Services.TryAddSingleton<RunWatch.Web.Data.Fields.IFieldDetails, RunWatch.Web.Data.Store.StoreFieldDetails>();
        builder.Services.AddRunWatchDashboardStoreData();
        builder.Services.TryAddSingleton<DashboardLiveBridge>();
        builder.Services.AddSingleton<IIngestCommitListener>(sp => sp.GetRequiredService<DashboardLiveBridge>());
        builder.Services.AddSingleton<IAlertListener>(sp => sp.GetRequiredService<DashboardLiveBridge>());
        // Fleet: samples committed by the other daemons sharing a PostgreSQL store (idle on SQLite).
        builder.Services.AddHostedService<FleetLiveRelay>();
        return builder;
    }

    public static WebApplication MapRunWatch(this WebApplication app)
    {
        app.MapRunWatchDaemon();
        app.MapRunWatchDashboard();
        app.MapRunWatchFieldUpload().RequireAuthorization(RunWatch.Web.Security.DashboardRoles.CanActPolicy);
        app.MapRunWatchReanalyse().RequireAuthorization(RunWatch.Web.Security.DashboardRoles.CanActPolicy);
        app.MapRunWatchPipelineProgress().RequireAuthorization();
        return app;
    }
}
