namespace RunWatch.Web.Data;

/// <summary>Severity of an alert or excursion.</summary>
public enum AlertSeverity
{
    Warning,
    Alarm,
}
