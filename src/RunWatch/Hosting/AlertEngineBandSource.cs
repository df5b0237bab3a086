using RunWatch.Ingest.Alerts;
using RunWatch.Web.Data;

namespace RunWatch.Hosting;

/// <summary>The dashboard's chamber bands taken from the alert engine's chamber configuration.</summary>
internal sealed class AlertEngineBandSource(IChamberAlarmBands bands) : IChamberBandSource
{
    public TemperatureBands? BandsFor(string chamber) =>
        bands.BandsFor(chamber) is { } b ? new TemperatureBands(b.WarningBandK, b.AlarmBandK) : null;
}
