namespace RunWatch.Core.Model;

/// <summary>A calibration together with its acceptance.</summary>
public sealed record AcceptedCalibration(CalibrationRecord Record, CalibrationAcceptance Acceptance);
