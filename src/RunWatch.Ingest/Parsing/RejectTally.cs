namespace RunWatch.Ingest.Parsing;

/// <summary>Reject counts of one batch, by reason; also the first detail seen per reason, for rate-limited logs.</summary>
internal sealed class RejectTally
{
    private readonly long[] _counts = new long[RejectReasons.Count];
    private readonly string?[] _firstDetail = new string?[RejectReasons.Count];

    public long Total { get; private set; }

    public long this[RejectReason reason] => _counts[(int)reason];

    public string? FirstDetail(RejectReason reason) => _firstDetail[(int)reason];

    public void Add(RejectReason reason, string? detail, long count = 1)
    {
        _counts[(int)reason] += count;
        _firstDetail[(int)reason] ??= detail;
        Total += count;
    }

    public void Clear()
    {
        Array.Clear(_counts);
        Array.Clear(_firstDetail);
        Total = 0;
    }
}
