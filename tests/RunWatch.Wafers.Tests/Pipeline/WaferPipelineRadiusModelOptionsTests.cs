using Microsoft.Extensions.Configuration;
using RunWatch.Core.Wafers;
using RunWatch.Wafers.Pipeline;
using Xunit;

namespace RunWatch.Wafers.Tests.Pipeline;

/// <summary>The radius-model settings of <see cref="WaferPipelineOptions"/>: the diffusion model by default, the simpler options by name.</summary>
public sealed class WaferPipelineRadiusModelOptionsTests
{
    [Fact]
    public void Defaults_DiffusionModelAndValid()
    {
        var options = new WaferPipelineOptions();

        Assert.Equal(WaferRadiusModel.Diffusion, options.RadiusModel);
        Assert.Empty(options.Validate());
    }

    [Theory]
    [InlineData("CaptureAreaRegression", WaferRadiusModel.CaptureAreaRegression)]
    [InlineData("VoronoiDisc", WaferRadiusModel.VoronoiDisc)]
    public void Bind_NamedOption_Selected(string configured, WaferRadiusModel expected)
    {
        IConfiguration configuration = new ConfigurationBuilder().AddInMemoryCollection(new Dictionary<string, string?> { ["WaferPipeline:RadiusModel"] = configured }).Build();

        var options = configuration.GetSection(WaferPipelineOptions.SectionName).Get<WaferPipelineOptions>()!;

        Assert.Equal(expected, options.RadiusModel);
        Assert.Empty(options.Validate());
    }

    [Fact]
    public void Validate_BadRadiusModelSettings_OneProblemEach()
    {
        var options = new WaferPipelineOptions { RadiusModel = (WaferRadiusModel)99, CaptureCellNm = 0, CalibrationLambdaMinUm = 3, CalibrationLambdaMaxUm = 1 };

        IReadOnlyList<string> problems = options.Validate();

        Assert.Equal(3, problems.Count);
        Assert.Contains(problems, p => p.Contains("RadiusModel", StringComparison.Ordinal));
        Assert.Contains(problems, p => p.Contains("CaptureCellNm", StringComparison.Ordinal));
        Assert.Contains(problems, p => p.Contains("CalibrationLambdaMinUm", StringComparison.Ordinal));
    }
}
