namespace RunWatch.Web.Data;

/// <summary>Deviation from setpoint, in kelvin (= °C difference), at which the chart draws the warning and alarm bands.</summary>
public sealed record TemperatureBands(double WarningK, double AlarmK);
