using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Options;
using RunWatch.Wafers.Pipeline;
using Xunit;

namespace RunWatch.Wafers.Tests.Pipeline;

/// <summary>Reports take the dashboard's time zone (one clock for reports and screens); an unknown zone is refused at start.</summary>
public sealed class ReportClockOptionsTests
{
    [Theory]
    [InlineData("Asia/Kolkata", true)]
    [InlineData("", true)]
    [InlineData("Mars/Olympus_Mons", false)]
    public void WaferPipelineOptions_DashboardTimeZone_TakenOverAndChecked(string zone, bool valid)
    {
        IConfiguration configuration = new ConfigurationBuilder().AddInMemoryCollection(new Dictionary<string, string?>
        {
            ["RunWatch:Dashboard:TimeZone"] = zone,
        }).Build();
        var services = new ServiceCollection();
        services.AddLogging();
        services.AddRunWatchWaferPipeline(configuration, runWorkers: false);
        using ServiceProvider provider = services.BuildServiceProvider();

        if (valid)
        {
            Assert.Equal(zone, provider.GetRequiredService<IOptions<WaferPipelineOptions>>().Value.TimeZone);
        }
        else
        {
            var failure = Assert.Single(Assert.Throws<OptionsValidationException>(() => provider.GetRequiredService<IOptions<WaferPipelineOptions>>().Value).Failures);
            Assert.Contains("Mars/Olympus_Mons", failure, StringComparison.Ordinal);
        }
    }
}
