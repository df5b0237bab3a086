using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.DependencyInjection.Extensions;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Options;
using Prometheus;
using RunWatch.Ingest.Configuration;
using RunWatch.Ingest.Health;
using RunWatch.Ingest.Mqtt;
using RunWatch.Ingest.Pipeline;
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
            .Validate(o => o.Validate().Count == 0, "Chambers: invalid configuration (see the chamber list in config/README.md)")
            .ValidateOnStart();

        services.TryAddSingleton<ChamberRegistryHolder>();
        services.TryAddSingleton<InboundQueue>();
        services.TryAddSingleton<IngestHealth>();
        services.TryAddSingleton(sp => new IngestMetrics(sp.GetRequiredService<CollectorRegistry>()));
        services.TryAddSingleton<MqttConnectionService>();
        services.TryAddSingleton<IMessageAcknowledger>(sp => sp.GetRequiredService<MqttConnectionService>());
        services.TryAddSingleton<IMqttPublisher>(sp => sp.GetRequiredService<MqttConnectionService>());
        services.TryAddSingleton<IngestPipeline>();

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
        services.AddHostedService<IngestService>();
        return services;
    }
}
