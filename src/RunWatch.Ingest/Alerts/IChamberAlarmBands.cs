namespace RunWatch.Ingest.Alerts;

/// <summary>The deviation bands the alert engine applies to a chamber, for screens that draw them.</summary>
public interface IChamberAlarmBands
{
    /// <summary>Warning and alarm half-widths around the setpoint (K) of the chamber's growth temperature, or null for an unknown chamber.</summary>
    (double WarningBandK, double AlarmBandK)? BandsFor(string chamber);
}
