namespace RunWatch.Ingest.Pipeline;

/// <summary>A sample just committed to the store (new, not a duplicate), with names for listeners outside Ingest.</summary>
public readonly record struct CommittedSample(string Chamber, string Channel, DateTimeOffset Time, double Value);
