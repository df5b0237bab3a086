using RunWatch.Core.Excursions;
using RunWatch.Simulation.Chamber;
using Xunit;

namespace RunWatch.Simulation.Tests.Chamber;

public sealed class ChamberSimulatorTests
{
    [Fact]
    public void Run_SameSeed_GivesSameSamples()
    {
        var a = new ChamberSimulator(new ChamberSimulatorOptions { Seed = 7 }).Run().Take(20_000).ToList();
        var b = new ChamberSimulator(new ChamberSimulatorOptions { Seed = 7 }).Run().Take(20_000).ToList();
        var c = new ChamberSimulator(new ChamberSimulatorOptions { Seed = 8 }).Run().Take(20_000).ToList();
        Assert.Equal(a, b);
        Assert.NotEqual(a, c);
    }

    [Fact]
    public void Run_GrowthStep_OpensShutterForTheRecipeDuration()
    {
        var simulator = new ChamberSimulator(new ChamberSimulatorOptions());
        var growth = simulator.Schedule().Single(s => s.Step.Name == "growth");
        var samples = simulator.Run().ToList();
        var open = samples.Where(s => s.Step == "growth" && s.GaShutter == 1).ToList();
        Assert.Equal(1800, open[^1].TimeS - open[0].TimeS, 0.2);
        Assert.Equal(growth.StartS, open[0].TimeS, 0.11);
        Assert.All(samples.Where(s => s.Step is "stabilise" or "cool-down"), s => Assert.Equal(0, s.GaShutter));
        Assert.Equal(250, samples[^1].SubstrateSpC, 1e-9);
    }

    [Fact]
    public void Run_GrowthWindow_HasExactlyTheInjectedExcursion()
    {
        // The demo's one over-temperature event is what the Core excursion monitor should find in the growth window.
        var options = new ChamberSimulatorOptions();
        var simulator = new ChamberSimulator(options);
        var growth = simulator.Schedule().Single(s => s.Step.Name == "growth");
        var observer = new Collector();
        var monitor = new ExcursionMonitor(new ExcursionOptions { FlatlineWindow = null }, observer: observer);
        foreach (ChamberSample s in simulator.Run().Where(s => s.Step == "growth"))
        {
            monitor.Observe(s.TimeS, s.SubstrateTcC, s.SubstrateSpC);
        }
        monitor.Flush(growth.EndS);
        Assert.True(observer.Excursions.Count == 1, string.Join("; ", observer.Excursions));
        ExcursionSummary excursion = observer.Excursions[0];
        double injectedAt = growth.StartS + options.ExcursionAfter.TotalSeconds;
        Assert.InRange(excursion.StartS, injectedAt, injectedAt + options.ExcursionDuration.TotalSeconds);
        Assert.True(excursion.PeakDeviationK > 15, $"peak {excursion.PeakDeviationK} K");
        Assert.Equal(ExcursionSeverity.Alarm, excursion.Severity);
    }

    [Fact]
    public void Run_OutsideExcursion_TracksSetpointDuringGrowth()
    {
        var options = new ChamberSimulatorOptions { ExcursionStep = null };
        var growth = new ChamberSimulator(options).Schedule().Single(s => s.Step.Name == "growth");
        var deviations = new ChamberSimulator(options).Run()
            .Where(s => s.Step == "growth")
            .Select(s => Math.Abs(s.SubstrateTcC - s.SubstrateSpC))
            .ToList();
        Assert.True(deviations.Max() < 1.5, $"max deviation {deviations.Max()} K");
        Assert.True(growth.EndS - growth.StartS >= 1800);
    }

    [Fact]
    public void Options_Invalid_AreRejected()
    {
        Assert.Empty(new ChamberSimulatorOptions().Validate());
        Assert.Contains(new ChamberSimulatorOptions { SampleInterval = TimeSpan.Zero }.Validate(), e => e.StartsWith("SampleInterval", StringComparison.Ordinal));
        Assert.Contains(new ChamberSimulatorOptions { ExcursionStep = "nope" }.Validate(), e => e.StartsWith("ExcursionStep", StringComparison.Ordinal));
        Assert.Contains(new ChamberSimulatorOptions { Recipe = [new RecipeStep("x", 600, 0, 10, false)] }.Validate(), e => e.StartsWith("Recipe step", StringComparison.Ordinal));
        Assert.Throws<ArgumentException>(() => new ChamberSimulator(new ChamberSimulatorOptions { HeaterGainK = 0 }));
    }

    private sealed class Collector : IExcursionObserver
    {
        public List<ExcursionSummary> Excursions { get; } = [];

        public void OnAlarmChanged(in AlarmTransition transition)
        {
        }

        public void OnExcursionEnded(in ExcursionSummary summary) => Excursions.Add(summary);
    }
}
