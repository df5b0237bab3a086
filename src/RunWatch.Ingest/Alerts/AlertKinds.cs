using RunWatch.Core.Excursions;
using RunWatch.Storage;

namespace RunWatch.Ingest.Alerts;

/// <summary>Kind codes and severities of alerts.</summary>
internal static class AlertKinds
{
    public const string StoreUnwritable = "store-unwritable";

    public static string Code(AlarmKind kind) => kind switch
    {
        AlarmKind.DeviationWarning => "deviation-warning",
        AlarmKind.DeviationAlarm => "deviation-alarm",
        AlarmKind.HighLimit => "high-limit",
        AlarmKind.LowLimit => "low-limit",
        AlarmKind.RateOfChange => "rate-of-change",
        AlarmKind.Stale => "stale-telemetry",
        AlarmKind.Flatline => "flatline",
        _ => kind.ToString(),
    };

    public static AlarmKind? Parse(string code) => code switch
    {
        "deviation-warning" => AlarmKind.DeviationWarning,
        "deviation-alarm" => AlarmKind.DeviationAlarm,
        "high-limit" => AlarmKind.HighLimit,
        "low-limit" => AlarmKind.LowLimit,
        "rate-of-change" => AlarmKind.RateOfChange,
        "stale-telemetry" => AlarmKind.Stale,
        "flatline" => AlarmKind.Flatline,
        _ => null,
    };

    public static AlertSeverity Severity(string code) => code switch
    {
        "deviation-alarm" or "high-limit" or "low-limit" or "stale-telemetry" or StoreUnwritable => AlertSeverity.High,
        "deviation-warning" or "rate-of-change" or "flatline" => AlertSeverity.Medium,
        _ => AlertSeverity.Low,
    };

    public static string Describe(AlarmKind kind) => kind switch
    {
        AlarmKind.DeviationWarning => "growth temperature outside the warning band around the setpoint",
        AlarmKind.DeviationAlarm => "growth temperature outside the alarm band around the setpoint",
        AlarmKind.HighLimit => "growth temperature above the high limit",
        AlarmKind.LowLimit => "growth temperature below the low limit",
        AlarmKind.RateOfChange => "growth temperature changing faster than allowed",
        AlarmKind.Stale => "no growth-temperature telemetry during an open run",
        AlarmKind.Flatline => "growth temperature reading has not changed (stuck sensor?)",
        _ => kind.ToString(),
    };
}
