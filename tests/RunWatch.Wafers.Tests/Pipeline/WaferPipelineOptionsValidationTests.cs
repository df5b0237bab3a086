using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Options;
using RunWatch.Core.Qc;
using RunWatch.Wafers.Intake;
using RunWatch.Wafers.Pipeline;
using Xunit;

namespace RunWatch.Wafers.Tests.Pipeline;

/// <summary>The wafer room's three options sections report their own error lists at start, one failure per problem.</summary>
public sealed class WaferPipelineOptionsValidationTests
{
    private static readonly Dictionary<string, string?> Bad = new()
    {
        ["Intake:DropFolder"] = " ",
        ["Intake:RescanInterval"] = "00:00:00",
        ["WaferPipeline:QueueCapacity"] = "0",
        ["WaferPipeline:PredictionFields"] = "0",
        ["Qc:Default:TargetMeanRadiusNm"] = "-1",
        ["Qc:Default:MinWireCount"] = "0",
    };

    private static (ServiceProvider Provider, IConfiguration Configuration) Build()
    {
        IConfiguration configuration = new ConfigurationBuilder().AddInMemoryCollection(Bad).Build();
        var services = new ServiceCollection();
        services.AddLogging();
        services.AddRunWatchWaferPipeline(configuration, runWorkers: false);
        return (services.BuildServiceProvider(), configuration);
    }

    [Fact]
    public void Options_BadValuesInEachSection_EachSectionReportsItsOwnList()
    {
        var (provider, configuration) = Build();
        using (provider)
        {
            var intake = configuration.GetSection(IntakeOptions.SectionName).Get<IntakeOptions>()!;
            var pipeline = configuration.GetSection(WaferPipelineOptions.SectionName).Get<WaferPipelineOptions>()!;
            var qc = configuration.GetSection(QcOptions.SectionName).Get<QcOptions>()!;

            var intakeFailures = Assert.Throws<OptionsValidationException>(() => provider.GetRequiredService<IOptions<IntakeOptions>>().Value).Failures.ToList();
            var pipelineFailures = Assert.Throws<OptionsValidationException>(() => provider.GetRequiredService<IOptions<WaferPipelineOptions>>().Value).Failures.ToList();
            var qcFailures = Assert.Throws<OptionsValidationException>(() => provider.GetRequiredService<IOptions<QcOptions>>().Value).Failures.ToList();

            // The same problems the options' own checks list, in their words (with the section named once).
            Assert.Equal(intake.Validate(), intakeFailures);
            Assert.Equal(2, intakeFailures.Count);
            Assert.Equal(pipeline.Validate(), pipelineFailures);
            Assert.Equal(2, pipelineFailures.Count);
            Assert.Equal(qc.Validate().Select(e => "Qc: " + e), qcFailures);
            // A negative target without its tolerance is two problems; the wire count a third.
            Assert.Equal(3, qcFailures.Count);
            Assert.DoesNotContain(intakeFailures.Concat(pipelineFailures).Concat(qcFailures), f => f.Contains("see the log", StringComparison.Ordinal));
        }
    }

    [Fact]
    public void StartupValidation_BadValuesInThreeSections_AllSevenProblemsReported()
    {
        var (provider, _) = Build();
        using (provider)
        {
            var thrown = Record.Exception(() => provider.GetRequiredService<IStartupValidator>().Validate());

            var failures = (thrown is AggregateException all ? all.InnerExceptions : [thrown!])
                .OfType<OptionsValidationException>().SelectMany(e => e.Failures).ToList();
            Assert.Equal(7, failures.Count);
            Assert.Contains("Intake:DropFolder is empty", failures);
            Assert.Contains("WaferPipeline:QueueCapacity must be 1 … 100000", failures);
        }
    }
}
