using Microsoft.Extensions.Logging;
using RunWatch.Ingest.Parsing;

namespace RunWatch.Ingest.Pipeline;

/// <summary>At most one warning per reject reason per interval; what is held back is counted into the next line.</summary>
internal sealed class RejectLogLimiter(ILogger logger, TimeProvider timeProvider, TimeSpan interval)
{
    private readonly long[] _lastLogged = new long[RejectReasons.Count];
    private readonly long[] _suppressed = new long[RejectReasons.Count];

    public void Report(RejectTally tally, string? sampleTopic)
    {
        long now = timeProvider.GetTimestamp();
        for (int i = 0; i < RejectReasons.Count; i++)
        {
            var reason = (RejectReason)i;
            long count = tally[reason];
            if (count == 0)
            {
                continue;
            }
            if (_lastLogged[i] != 0 && timeProvider.GetElapsedTime(_lastLogged[i], now) < interval)
            {
                _suppressed[i] += count;
                continue;
            }
            Log.InputRejected(logger, count + _suppressed[i], RejectReasons.Code(reason), tally.FirstDetail(reason) ?? "", sampleTopic ?? "");
            _suppressed[i] = 0;
            _lastLogged[i] = now;
        }
    }
}
