namespace RunWatch.Core.Model;

/// <summary>Who accepted a calibration for use, and when.</summary>
/// <param name="AcceptedBy">The person's user name as authenticated by the caller.</param>
/// <param name="AcceptedAt">Time of acceptance.</param>
/// <param name="Comment">Optional reason.</param>
public sealed record CalibrationAcceptance(string AcceptedBy, DateTimeOffset AcceptedAt, string? Comment);
