using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Options;
using Prometheus;
using RunWatch.Ingest.Alerts;
using RunWatch.Ingest.Configuration;
using RunWatch.Ingest.Retention;
using RunWatch.Storage;
using RunWatch.Testing;
using RunWatch.Testing.Mqtt;

namespace RunWatch.Ingest.Tests.Configuration;

public sealed class OptionsValidationTests
{
    [Theory]
    [InlineData("Broker:SessionExpiry", "00:00:00")]
    [InlineData("Broker:Port", "0")]
    [InlineData("Broker:ProtocolVersion", "V4")]
    [InlineData("Broker:ReconnectMaxDelay", "00:00:00.1")]
    [InlineData("Ingest:MaxBatchMessages", "5000")]
    [InlineData("Ingest:MaxBatchDelay", "00:00:00")]
    [InlineData("Ingest:TopicRoot", "a/b")]
    [InlineData("Storage:Synchronous", "Off")]
    [InlineData("Storage:Provider", "Postgres")]
    [InlineData("Alerts:WebhookUrl", "not a url")]
    [InlineData("Retention:PruneInterval", "00:00:00")]
    [InlineData("Chambers:0:Channels:0:Min", "2000")]
    [InlineData("Chambers:0:Channels:1:Role", "GrowthTemperature")]
    [InlineData("Chambers:0:Runs:Mode", "Shutter")]
    [InlineData("Chambers:0:Excursions:AlarmBandK", "1")]
    [InlineData("Chambers:0:Process:D0CmSqPerS", "-1")]
    public void Validate_BadValue_FailsWithOptionsValidationException(string key, string value)
    {
        var settings = DaemonSettings.ForTestChamber(1883, "data");
        settings[key] = value;
        if (key == "Chambers:0:Runs:Mode")
        {
            settings["Chambers:0:Channels:2:Role"] = "Other";
        }
        using var provider = Provider(settings);

        Assert.Throws<OptionsValidationException>(() => ResolveAll(provider));
    }

    [Fact]
    public void ValidateOnStart_TwoChamberProblems_EachReportedInItsOwnWords()
    {
        var settings = DaemonSettings.ForTestChamber(1883, "data");
        settings["Chambers:0:Excursions:AlarmBandK"] = "1";
        settings["Chambers:0:Process:D0CmSqPerS"] = "-1";
        using var provider = Provider(settings);

        var ex = Assert.Throws<OptionsValidationException>(() => provider.GetRequiredService<IOptions<ChambersOptions>>().Value);

        // The same words the chamber list's own check gives, one failure each, not one generic line.
        var chambers = new ChambersOptions();
        new ConfigurationBuilder().AddInMemoryCollection(settings).Build().GetSection(ChambersOptions.SectionName).Bind(chambers.Items);
        var expected = chambers.Validate().Select(e => "Chambers: " + e).ToList();
        Assert.Equal(2, expected.Count);
        Assert.Equal(expected, ex.Failures);
        Assert.Contains(ex.Failures, f => f.Contains("chamber C1, Excursions:", StringComparison.Ordinal));
        Assert.Contains(ex.Failures, f => f.Contains("chamber C1, Process:", StringComparison.Ordinal));
    }

    [Fact]
    public void Validate_TestChamberDefaults_Pass()
    {
        using var provider = Provider(DaemonSettings.ForTestChamber(1883, "data"));
        ResolveAll(provider);
        Assert.Single(provider.GetRequiredService<IOptions<ChambersOptions>>().Value.Items);
    }

    [Fact]
    public void ExampleFiles_BindAndMatchTheCodeDefaults()
    {
        var configuration = new ConfigurationBuilder()
            .AddJsonFile(Path.Combine(RepositoryRoot.Path, "config", "appsettings.example.json"))
            .AddJsonFile(Path.Combine(RepositoryRoot.Path, "config", "chambers.json"))
            .Build();
        using var provider = Provider(configuration);
        ResolveAll(provider);

        var ingest = provider.GetRequiredService<IOptions<IngestOptions>>().Value;
        var defaults = new IngestOptions();
        Assert.Equal(defaults.MaxBatchDelay, ingest.MaxBatchDelay);
        Assert.Equal(defaults.MaxBatchMessages, ingest.MaxBatchMessages);
        Assert.Equal(defaults.MaxSampleAge, ingest.MaxSampleAge);
        Assert.Equal(new BrokerOptions().SessionExpiry, provider.GetRequiredService<IOptions<BrokerOptions>>().Value.SessionExpiry);
        Assert.Equal(new BrokerOptions().ReceiveMaximum, provider.GetRequiredService<IOptions<BrokerOptions>>().Value.ReceiveMaximum);
        Assert.Equal(new StorageOptions().DeadLetterLimit, provider.GetRequiredService<IOptions<StorageOptions>>().Value.DeadLetterLimit);
        var chamber = Assert.Single(provider.GetRequiredService<IOptions<ChambersOptions>>().Value.Items);
        Assert.Equal("demo-1", chamber.Name);
        Assert.Equal(2, chamber.Channels[0].Calibration.Count);
        Assert.Equal(700, chamber.Excursions.HighLimitC);
    }

    private static ServiceProvider Provider(Dictionary<string, string?> settings) =>
        Provider(new ConfigurationBuilder().AddInMemoryCollection(settings).Build());

    private static ServiceProvider Provider(IConfiguration configuration)
    {
        var services = new ServiceCollection();
        services.AddLogging();
        services.AddSingleton(Metrics.NewCustomRegistry());
        services.AddRunWatchIngest(configuration);
        return services.BuildServiceProvider();
    }

    private static void ResolveAll(ServiceProvider provider)
    {
        _ = provider.GetRequiredService<IOptions<BrokerOptions>>().Value;
        _ = provider.GetRequiredService<IOptions<IngestOptions>>().Value;
        _ = provider.GetRequiredService<IOptions<StorageOptions>>().Value;
        _ = provider.GetRequiredService<IOptions<AlertsOptions>>().Value;
        _ = provider.GetRequiredService<IOptions<RetentionOptions>>().Value;
        _ = provider.GetRequiredService<IOptions<ChambersOptions>>().Value;
    }
}
