namespace RunWatch.Imaging.Analysis;

/// <summary>Wall time of one pipeline stage.</summary>
public sealed record StageTiming(string Stage, double Milliseconds);
