namespace RunWatch.Storage;

/// <summary>Timestamps as stored: microseconds since the Unix epoch, UTC.</summary>
public static class UnixMicros
{
    /// <summary>Microseconds since the Unix epoch of <paramref name="value"/>.</summary>
    public static long From(DateTimeOffset value) => (value.UtcTicks - DateTimeOffset.UnixEpoch.UtcTicks) / TimeSpan.TicksPerMicrosecond;

    /// <summary>The instant <paramref name="micros"/> microseconds after the Unix epoch, as UTC.</summary>
    public static DateTimeOffset ToDateTimeOffset(long micros) => DateTimeOffset.UnixEpoch.AddTicks(micros * TimeSpan.TicksPerMicrosecond);
}
