namespace RunWatch.Growth;

/// <summary>A window edge given either as an ISO-8601 instant or as seconds on the log's own time axis.</summary>
internal readonly record struct GrowthInstant(DateTimeOffset? Instant, double? Seconds)
{
    /// <summary>Seconds on a log's axis whose first row is at <paramref name="origin"/> (null for a plain-seconds log).</summary>
    public double ToLogSeconds(DateTimeOffset? origin, string file, string field)
    {
        if (Seconds is { } s)
        {
            return s;
        }
        if (origin is null)
        {
            throw new GrowthCaseException(file, field, "is an ISO time, but the thermal log uses plain seconds; give seconds on the log's axis instead");
        }
        return (Instant!.Value - origin.Value).TotalSeconds;
    }
}
