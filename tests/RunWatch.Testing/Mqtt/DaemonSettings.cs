using System.Globalization;

namespace RunWatch.Testing.Mqtt;

/// <summary>Configuration of a daemon under test: external broker on loopback, temp data folder, the invented chamber "C1" at site "lab".</summary>
public static class DaemonSettings
{
    public static Dictionary<string, string?> ForTestChamber(int brokerPort, string folder) => new()
    {
        ["Broker:Mode"] = "External",
        ["Broker:Host"] = "127.0.0.1",
        ["Broker:Port"] = brokerPort.ToString(CultureInfo.InvariantCulture),
        ["Broker:ClientId"] = "runwatch-test-" + Path.GetFileName(folder),
        ["Broker:ReconnectInitialDelay"] = "00:00:00.200",
        ["Broker:ReconnectMaxDelay"] = "00:00:01",
        ["Storage:DataDirectory"] = folder,
        ["Storage:Synchronous"] = "Normal",
        ["Chambers:0:Name"] = "C1",
        ["Chambers:0:Site"] = "lab",
        ["Chambers:0:Channels:0:Name"] = "substrate_tc",
        ["Chambers:0:Channels:0:Role"] = "GrowthTemperature",
        ["Chambers:0:Channels:0:Unit"] = "degC",
        ["Chambers:0:Channels:0:Min"] = "-50",
        ["Chambers:0:Channels:0:Max"] = "1200",
        ["Chambers:0:Channels:1:Name"] = "substrate_sp",
        ["Chambers:0:Channels:1:Role"] = "Setpoint",
        ["Chambers:0:Channels:1:Unit"] = "degC",
        ["Chambers:0:Channels:2:Name"] = "ga_shutter",
        ["Chambers:0:Channels:2:Role"] = "GrowthShutter",
        ["Chambers:0:Channels:2:Unit"] = "1",
    };

    /// <summary>The same as <c>--Key=value</c> arguments for <see cref="ServeProcess"/>, with logs under the folder and no chamber file.</summary>
    public static Dictionary<string, string> ForServe(int brokerPort, string folder, string clientId)
    {
        var settings = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var (key, value) in ForTestChamber(brokerPort, folder))
        {
            settings[key] = value!;
        }
        settings["Broker:ClientId"] = clientId;
        settings["ChambersFile"] = Path.Combine(folder, "no-chambers-file.json");
        settings["Storage:Synchronous"] = "Full";
        settings["Serilog:WriteTo:1:Args:path"] = Path.Combine(folder, "logs", "runwatch-.log");
        return settings;
    }
}
