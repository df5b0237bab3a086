namespace RunWatch.Ingest.Tests.Support;

/// <summary>Waits for a condition by polling (no Thread.Sleep), failing with a description after a timeout.</summary>
internal static class Poll
{
    public static async Task UntilAsync(Func<bool> condition, TimeSpan timeout, string what)
    {
        var deadline = DateTime.UtcNow + timeout;
        while (!condition())
        {
            if (DateTime.UtcNow > deadline)
            {
                throw new TimeoutException("timed out waiting for: " + what);
            }
            await Task.Delay(50).ConfigureAwait(false);
        }
    }

    /// <summary>Waits until <paramref name="value"/> reaches <paramref name="target"/> or stops changing for <paramref name="quiet"/>; returns the last value.</summary>
    public static async Task<long> UntilReachedOrStalledAsync(Func<long> value, long target, TimeSpan quiet, TimeSpan timeout)
    {
        var deadline = DateTime.UtcNow + timeout;
        long last = value();
        var lastChange = DateTime.UtcNow;
        while (last < target && DateTime.UtcNow < deadline && DateTime.UtcNow - lastChange < quiet)
        {
            await Task.Delay(100).ConfigureAwait(false);
            long now = value();
            if (now != last)
            {
                last = now;
                lastChange = DateTime.UtcNow;
            }
        }
        return last;
    }
}
