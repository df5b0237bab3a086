using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.DependencyInjection.Extensions;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using Prometheus;
using Microsoft.Extensions.Http.Resilience;
using Polly;
using RunWatch.Ingest.Alerts;
using RunWatch.Ingest.Chambers;
using RunWatch.Ingest.Configuration;
using RunWatch.Ingest.Fleet;
using RunWatch.Ingest.Health;
using RunWatch.Ingest.Mqtt;
using RunWatch.Ingest.Pipeline;
using RunWatch.Ingest.Retention;
using RunWatch.Ingest.Runs;
using RunWatch.Storage;

namespace RunWatch.Ingest;

/// <summary>Registers the daemon's ingest side: store, broker connection (and embedded broker), pipeline, run tracking, alerts, retention.</summary>
public static partial class IngestServiceCollectionExtensions
{
    /// <summary>
    /// Binds and validates the <c>Broker</c>, <c>Ingest</c>, <c>Chambers</c>, <c>Alerts</c> and <c>Retention</c>
    /// sections, registers the store (<c>Storage</c> section) and the hosted services in the order they must start
    /// (store migration, embedded broker, MQTT connection, committer, run tracking, alerts, retention).
    /// They stop in reverse, so the committer drains and acknowledges before the connection closes.
    /// </summary>
    public static IServiceCollection AddRunWatchIngest(this IServiceCollection services, IConfiguration configuration)
    {
        ArgumentNullException.ThrowIfNull(services);
        ArgumentNullException.ThrowIfNull(configuration);
        services.AddRunWatchStorage(configuration);
        services.TryAddSingleton(TimeProvider.System);
        services.TryAddSingleton(Metrics.DefaultRegistry);

        services.AddOptions<BrokerOptions>()
            .Bind(configuration.GetSection(BrokerOptions.SectionName))
            .ValidateDataAnnotations()
            .Validate(o => o.SessionExpiry > TimeSpan.Zero, "Broker:SessionExpiry must be positive: a zero expiry gives no persistent session")
            .Validate(o => o.KeepAlive > TimeSpan.Zero && o.ReconnectInitialDelay > TimeSpan.Zero && o.ReconnectMaxDelay >= o.ReconnectInitialDelay,
                "Broker:KeepAlive and the reconnect delays must be positive, ReconnectMaxDelay ≥ ReconnectInitialDelay")
            .Validate(o => o.Mode != BrokerMode.Embedded || System.Net.IPAddress.TryParse(o.Host, out _), "Broker:Host must be an IP address for the embedded broker")
            .Validate(o => !o.UseTls || o.Mode == BrokerMode.External, "Broker:UseTls is for external brokers")
            .ValidateOnStart();
        services.AddOptions<IngestOptions>()
            .Bind(configuration.GetSection(IngestOptions.SectionName))
            .ValidateDataAnnotations()
            .Validate(o => o.MaxBatchDelay > TimeSpan.Zero && o.BatchLinger >= TimeSpan.Zero && o.MaxFutureSkew >= TimeSpan.Zero && o.MaxSampleAge > TimeSpan.Zero,
                "Ingest: MaxBatchDelay and MaxSampleAge must be positive, BatchLinger and MaxFutureSkew not negative")
            .ValidateOnStart();
        services.AddSingleton<IValidateOptions<IngestOptions>, BatchFitsReceiveMaximum>();
        services.AddOptions<ChambersOptions>()
            .Configure(o => configuration.GetSection(ChambersOptions.SectionName).Bind(o.Items))
            .ValidateErrorList(ChambersOptions.SectionName, o => o.Validate())
            .ValidateOnStart();

        services.AddOptions<FleetOptions>()
            .Bind(configuration.GetSection(FleetOptions.SectionName))
            .ValidateDataAnnotations()
            .Validate(o => !o.Enabled || configuration.GetSection(StorageOptions.SectionName).Get<StorageOptions>()?.UsesPostgres == true,
                "Fleet:Enabled needs Storage:Provider=PostgreSql: the daemons of a fleet share one PostgreSQL store")
            .Validate(o => !o.Enabled || configuration.GetSection(BrokerOptions.SectionName).GetValue(nameof(BrokerOptions.Mode), BrokerMode.Embedded) == BrokerMode.External,
                "Fleet:Enabled needs Broker:Mode=External: the daemons of a fleet share one broker that outlives each of them")
            .Validate(o => o.ClaimInterval > TimeSpan.Zero && o.LockKeepAlive >= TimeSpan.FromSeconds(1) && o.LockCommandTimeout >= TimeSpan.FromSeconds(1),
                "Fleet: ClaimInterval must be positive, LockKeepAlive and LockCommandTimeout at least 1 s")
            .Validate(o => o.ChamberClientId.Contains("{chamber}", StringComparison.Ordinal), "Fleet:ChamberClientId must contain {chamber}")
            .ValidateOnStart();
        bool fleet = configuration.GetSection(FleetOptions.SectionName).GetValue<bool>(nameof(FleetOptions.Enabled));
        services.TryAddSingleton<ChamberRegistryHolder>();
        services.TryAddSingleton<IChamberAlarmBands, ConfiguredAlarmBands>();
        services.TryAddSingleton<InboundQueue>();
        services.TryAddSingleton<IngestHealth>();
        services.TryAddSingleton(sp => new IngestMetrics(sp.GetRequiredService<CollectorRegistry>()));
        services.TryAddSingleton<MqttConnectionService>();
        services.TryAddSingleton<FleetState>();
        if (fleet)
        {
            services.TryAddSingleton<IMessageAcknowledger, FleetAcknowledger>();
        }
        services.TryAddSingleton<IMessageAcknowledger>(sp => sp.GetRequiredService<MqttConnectionService>());
        services.TryAddSingleton<IMqttPublisher>(sp => sp.GetRequiredService<MqttConnectionService>());
        services.TryAddSingleton<IngestPipeline>();

        services.AddOptions<AlertsOptions>()
            .Bind(configuration.GetSection(AlertsOptions.SectionName))
            .ValidateDataAnnotations()
            .Validate(o => o.WebhookRetryDelay > TimeSpan.Zero && o.WebhookAttemptTimeout > TimeSpan.Zero, "Alerts: webhook delays must be positive")
            .ValidateOnStart();
        services.AddOptions<RetentionOptions>()
            .Bind(configuration.GetSection(RetentionOptions.SectionName))
            .Validate(o => o.PruneInterval > TimeSpan.Zero && o.MaintenanceInterval > TimeSpan.Zero && o.DeadLetters > TimeSpan.Zero && o.NormalAlerts > TimeSpan.Zero
                && (o.Samples is null || o.Samples > TimeSpan.Zero), "Retention: intervals and ages must be positive")
            .ValidateOnStart();

        services.TryAddSingleton<AlertEngine>();
        services.AddSingleton<ICommittedBatchObserver>(sp => sp.GetRequiredService<RunTracker>());
        services.AddSingleton<ICommittedBatchObserver>(sp => sp.GetRequiredService<AlertEngine>());
        services.AddSingleton<ICommittedBatchObserver, CommitListenerBridge>();
        services.AddSingleton<IDaemonConditions>(sp => sp.GetRequiredService<AlertEngine>());
        services.AddSingleton<IRunLifecycleListener>(sp => sp.GetRequiredService<AlertEngine>());
        services.TryAddSingleton<RunTracker>();
        services.TryAddSingleton<IRunDiffusivity, ConfiguredRunDiffusivity>();
        services.TryAddSingleton<IRunDiffusionModels>(sp => new StoredRunDiffusionModels(sp.GetService<IWaferStore>(),
            sp.GetRequiredService<ILogger<StoredRunDiffusionModels>>()));
        services.TryAddSingleton<RunEvaluator>();
        services.TryAddSingleton<AlertDispatchService>();
        services.TryAddSingleton<IAlertCommands>(sp => sp.GetRequiredService<AlertDispatchService>());
        services.AddSingleton<IAlertSink, LogAlertSink>();
        services.AddSingleton<IAlertSink, ListenerAlertSink>();
        services.AddSingleton<IAlertSink, MqttAlertSink>();
        services.AddWebhookAlertSink();

        services.AddHealthChecks()
            .AddCheck<BrokerHealthCheck>("broker")
            .AddCheck<StoreHealthCheck>("store")
            .AddCheck<IngestLagHealthCheck>("ingest");

        services.AddHostedService<StoreStartupService>();
        if (configuration.GetSection(BrokerOptions.SectionName).GetValue(nameof(BrokerOptions.Mode), BrokerMode.Embedded) == BrokerMode.Embedded)
        {
            services.AddHostedService<EmbeddedBrokerService>();
        }
        services.AddHostedService(sp => sp.GetRequiredService<MqttConnectionService>());
        if (fleet)
        {
            // Before the committer, so that it stops after it: the committer's last acks still find their sessions.
            services.AddHostedService<ChamberOwnershipService>();
            services.AddHealthChecks().AddCheck<FleetHealthCheck>("fleet");
        }
        services.AddHostedService<IngestService>();
        services.AddHostedService<RunTrackingService>();
        services.AddHostedService(sp => sp.GetRequiredService<AlertDispatchService>());
        services.AddHostedService<RetentionService>();
        return services;
    }

    /// <summary>
    /// The webhook sink and its named HTTP client: exponential backoff with jitter on transient failures (5xx, 408,
    /// timeouts, connection errors), a timeout per attempt, no retry of a refusal such as 400 or 401.
    /// </summary>
    internal static IServiceCollection AddWebhookAlertSink(this IServiceCollection services)
    {
        services.AddSingleton<IAlertSink, WebhookAlertSink>();
        services.AddHttpClient(WebhookAlertSink.ClientName)
            .AddResilienceHandler("alert-webhook", (pipeline, context) =>
            {
                var o = context.ServiceProvider.GetRequiredService<IOptions<AlertsOptions>>().Value;
                pipeline.AddRetry(new HttpRetryStrategyOptions
                {
                    MaxRetryAttempts = Math.Max(1, o.WebhookRetries),
                    BackoffType = DelayBackoffType.Exponential,
                    UseJitter = true,
                    Delay = o.WebhookRetryDelay,
                    ShouldHandle = args => ValueTask.FromResult(o.WebhookRetries > 0 && HttpClientResiliencePredicates.IsTransient(args.Outcome)),
                });
                pipeline.AddTimeout(o.WebhookAttemptTimeout);
            });
        return services;
    }
}
