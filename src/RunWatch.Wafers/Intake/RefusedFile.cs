namespace RunWatch.Wafers.Intake;

/// <summary>A file in the drop folder that was not taken in, and why.</summary>
public sealed record RefusedFile(string RelativePath, string Reason);
