using RunWatch.Ingest.Chambers;
using RunWatch.Ingest.Configuration;
using RunWatch.Storage;

namespace RunWatch.Ingest.Tests.Support;

/// <summary>An invented test chamber "C1" at site "lab" and a registry built from it with fixed ids.</summary>
internal static class TestChambers
{
    public static ChamberOptions Chamber(RunDetectionMode mode = RunDetectionMode.Events) => new()
    {
        Name = "C1",
        Site = "lab",
        Description = "invented test chamber",
        Channels =
        [
            new ChannelOptions { Name = "substrate_tc", Role = ChannelRole.GrowthTemperature, Unit = "degC", Min = -50, Max = 1200 },
            new ChannelOptions { Name = "substrate_sp", Role = ChannelRole.Setpoint, Unit = "degC", Min = -50, Max = 1200 },
            new ChannelOptions { Name = "ga_shutter", Role = ChannelRole.GrowthShutter, Unit = "1", Min = 0, Max = 1 },
        ],
        Runs = new RunDetectionOptions { Mode = mode },
    };

    public static ChamberRegistry Registry(ChamberOptions? chamber = null)
    {
        chamber ??= Chamber();
        var channels = chamber.Channels.Select((c, i) => new RegisteredChannel(1, 10 + i,
            new ChannelDefinition(c.Name, c.Role, c.Unit, c.Min, c.Max, []))).ToArray();
        var registered = new RegisteredChamber(1, new ChamberDefinition(chamber.Name, chamber.Site, null, [.. channels.Select(c => c.Definition)]), channels);
        return new ChamberRegistry([chamber], [registered]);
    }
}
