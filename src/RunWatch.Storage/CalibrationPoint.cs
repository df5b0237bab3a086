namespace RunWatch.Storage;

/// <summary>One reference point of a piecewise-linear calibration: the reading the instrument gave and the true value.</summary>
/// <param name="Reading">Value as published, in the channel's unit.</param>
/// <param name="True">True value at that reading, in the same unit.</param>
public readonly record struct CalibrationPoint(double Reading, double True);
