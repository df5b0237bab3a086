using Microsoft.Extensions.Configuration;
using RunWatch.Core.Qc;
using RunWatch.Testing;
using RunWatch.Wafers.Intake;
using RunWatch.Wafers.Pipeline;
using RunWatch.Web;
using Xunit;

namespace RunWatch.Tests.Configuration;

/// <summary>config/appsettings.example.json lists the sections a newcomer sets, with the code's own defaults.</summary>
public sealed class ExampleSettingsTests
{
    private static readonly IConfiguration Example = new ConfigurationBuilder()
        .AddJsonFile(Path.Combine(RepositoryRoot.Path, "config", "appsettings.example.json"))
        .Build();

    [Fact]
    public void Example_EverySection_Present()
    {
        foreach (string section in new[] { "Storage", "Broker", "Ingest", "Alerts", "Retention", IntakeOptions.SectionName,
            WaferPipelineOptions.SectionName, QcOptions.SectionName, DashboardOptions.SectionName })
        {
            Assert.True(Example.GetSection(section).GetChildren().Any(), section + " is missing from the example");
        }
    }

    [Fact]
    public void Example_IntakePipelineAndDashboard_BindToTheCodeDefaults()
    {
        var intake = Example.GetSection(IntakeOptions.SectionName).Get<IntakeOptions>(o => o.ErrorOnUnknownConfiguration = true)!;
        var pipeline = Example.GetSection(WaferPipelineOptions.SectionName).Get<WaferPipelineOptions>(o => o.ErrorOnUnknownConfiguration = true)!;
        var dashboard = Example.GetSection(DashboardOptions.SectionName).Get<DashboardOptions>(o => o.ErrorOnUnknownConfiguration = true)!;
        var qc = Example.GetSection(QcOptions.SectionName).Get<QcOptions>(o => o.ErrorOnUnknownConfiguration = true) ?? new QcOptions();

        var i = new IntakeOptions();
        Assert.Equal((i.DropFolder, i.FileNamePattern, i.RescanInterval, i.StableFor, i.MaxUploadBytes),
            (intake.DropFolder, intake.FileNamePattern, intake.RescanInterval, intake.StableFor, intake.MaxUploadBytes));
        var p = new WaferPipelineOptions();
        Assert.Equal((p.ReportsFolder, p.QueueCapacity, p.DefaultProcess, p.DefaultPixelSizeNm, p.PredictionSeed, p.PredictionFields, p.CaptureRadiusSearchMin, p.CaptureRadiusSearchMax),
            (pipeline.ReportsFolder, pipeline.QueueCapacity, pipeline.DefaultProcess, pipeline.DefaultPixelSizeNm, pipeline.PredictionSeed, pipeline.PredictionFields,
                pipeline.CaptureRadiusSearchMin, pipeline.CaptureRadiusSearchMax));
        var d = new DashboardOptions();
        Assert.Equal((d.TimeZone, d.MaxChartPoints, d.LiveWindow, d.LiveRedrawInterval, d.WarningBandK, d.AlarmBandK, d.ReminderChannelStaleAfter, d.MaxShelveDuration),
            (dashboard.TimeZone, dashboard.MaxChartPoints, dashboard.LiveWindow, dashboard.LiveRedrawInterval, dashboard.WarningBandK, dashboard.AlarmBandK,
                dashboard.ReminderChannelStaleAfter, dashboard.MaxShelveDuration));
        Assert.Equal((d.Planner.D0CmSquaredPerSecond, d.Planner.ActivationEnergyEv, d.Planner.ConventionFactor, d.Planner.RadiusInterceptNm, d.Planner.RadiusSlopeNm),
            (dashboard.Planner.D0CmSquaredPerSecond, dashboard.Planner.ActivationEnergyEv, dashboard.Planner.ConventionFactor, dashboard.Planner.RadiusInterceptNm,
                dashboard.Planner.RadiusSlopeNm));
        Assert.Empty(dashboard.Users);
        Assert.Empty(qc.Recipes);
        Assert.Null(qc.Default);
    }
}
