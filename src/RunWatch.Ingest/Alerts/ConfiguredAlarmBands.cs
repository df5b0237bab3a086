using RunWatch.Ingest.Chambers;

namespace RunWatch.Ingest.Alerts;

/// <summary>Reads the bands from the chamber configuration in force (the same options the alert engine's monitors use).</summary>
internal sealed class ConfiguredAlarmBands(ChamberRegistryHolder registry) : IChamberAlarmBands
{
    public (double WarningBandK, double AlarmBandK)? BandsFor(string chamber)
    {
        if (!registry.IsReady)
        {
            return null;
        }
        foreach (var runtime in registry.Registry.All)
        {
            if (runtime.Name == chamber)
            {
                var excursions = runtime.Options.Excursions;
                return (excursions.WarningBandK, excursions.AlarmBandK);
            }
        }
        return null;
    }
}
