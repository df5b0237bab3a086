namespace RunWatch.Web.Data;

/// <summary>Where a host that runs the alert engine says which deviation bands a chamber's alerts use, so the charts draw the same ones.</summary>
public interface IChamberBandSource
{
    /// <summary>The chamber's bands, or null to fall back to the dashboard's configured ones.</summary>
    TemperatureBands? BandsFor(string chamber);
}
