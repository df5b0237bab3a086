namespace RunWatch.Web.Data;

/// <summary>One committed sample, as the ingest announces it.</summary>
public sealed record LiveSample(string Chamber, string Channel, DateTimeOffset Time, double Value);
