using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.DependencyInjection.Extensions;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using RunWatch.Core.Qc;
using RunWatch.Wafers.Intake;
using RunWatch.Storage;

namespace RunWatch.Wafers.Pipeline;

/// <summary>Registers the wafer pipeline: drop-folder intake, the analysis queue and worker, and report writing.</summary>
public static class WaferPipelineServiceCollectionExtensions
{
    /// <summary>
    /// Binds and validates <see cref="IntakeOptions"/>, <see cref="WaferPipelineOptions"/> and <see cref="QcOptions"/>,
    /// uses the <see cref="IWaferStore"/> that <c>AddRunWatchStorage</c> registered (SQLite or PostgreSQL), report writing (judged by the store's
    /// <see cref="QcSpecificationCatalog"/>) and process calibration, and adds the intake and analysis hosted services.
    /// Call after the store is registered.
    /// </summary>
    public static IServiceCollection AddRunWatchWaferPipeline(this IServiceCollection services, IConfiguration configuration, bool runWorkers = true)
    {
        ArgumentNullException.ThrowIfNull(services);
        ArgumentNullException.ThrowIfNull(configuration);
        services.AddOptions<IntakeOptions>()
            .Bind(configuration.GetSection(IntakeOptions.SectionName))
            .ValidateErrorList(IntakeOptions.SectionName, o => o.Validate())
            .ValidateOnStart();
        services.AddOptions<WaferPipelineOptions>()
            .Bind(configuration.GetSection(WaferPipelineOptions.SectionName))
            // One clock for reports and screens: the dashboard's zone setting.
            .PostConfigure(o => o.TimeZone = configuration["RunWatch:Dashboard:TimeZone"] ?? "")
            .ValidateErrorList(WaferPipelineOptions.SectionName, o => o.Validate())
            .ValidateOnStart();
        services.AddOptions<QcOptions>()
            .Bind(configuration.GetSection(QcOptions.SectionName))
            .ValidateErrorList(QcOptions.SectionName, o => o.Validate())
            .ValidateOnStart();
        services.TryAddSingleton(TimeProvider.System);
        services.TryAddSingleton(sp => new FieldAnalysisQueue(sp.GetRequiredService<IOptions<WaferPipelineOptions>>().Value.QueueCapacity));
        services.TryAddSingleton(sp => new FieldIntake(
            sp.GetRequiredService<IWaferStore>(),
            sp.GetRequiredService<IRunWatchStore>(),
            sp.GetRequiredService<FieldAnalysisQueue>(),
            sp.GetRequiredService<IOptions<IntakeOptions>>().Value.FileNamePattern,
            sp.GetRequiredService<TimeProvider>(),
            sp.GetService<ILogger<FieldIntake>>()));
        services.TryAddSingleton<WaferReportService>();
        services.TryAddSingleton<ProcessCalibrationService>();
        if (runWorkers)
        {
            services.TryAddSingleton<FieldIntakeService>();
            services.TryAddSingleton<FieldAnalysisService>();
            services.TryAddSingleton<FieldUploader>();
            services.AddHostedService(sp => sp.GetRequiredService<FieldIntakeService>());
            services.AddHostedService(sp => sp.GetRequiredService<FieldAnalysisService>());
        }
        return services;
    }
}
