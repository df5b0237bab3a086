namespace RunWatch.Storage;

/// <summary>
/// What one ingest commit writes in a single transaction: samples, events and dead letters. Reusable: the single
/// ingest consumer fills it, commits it and calls <see cref="Clear"/>. Not thread-safe.
/// </summary>
public sealed class IngestBatch
{
    private SampleRow[] _samples;
    private bool[] _inserted;

    /// <summary>Creates a batch with room for <paramref name="initialSampleCapacity"/> samples (it grows as needed).</summary>
    public IngestBatch(int initialSampleCapacity = 1024)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(initialSampleCapacity);
        _samples = new SampleRow[initialSampleCapacity];
        _inserted = new bool[initialSampleCapacity];
    }

    /// <summary>Number of samples in the batch.</summary>
    public int SampleCount { get; private set; }

    /// <summary>The samples added so far.</summary>
    public ReadOnlySpan<SampleRow> Samples => _samples.AsSpan(0, SampleCount);

    /// <summary>After a commit: whether each sample was new (true) or already stored (false, a duplicate).</summary>
    public ReadOnlySpan<bool> Inserted => _inserted.AsSpan(0, SampleCount);

    /// <summary>Writable view of <see cref="Inserted"/> for store implementations.</summary>
    public Span<bool> InsertedForWrite => _inserted.AsSpan(0, SampleCount);

    /// <summary>Events to store.</summary>
    public List<EventRecord> Events { get; } = [];

    /// <summary>Dead letters to store.</summary>
    public List<DeadLetter> DeadLetters { get; } = [];

    /// <summary>True when there is nothing to write.</summary>
    public bool IsEmpty => SampleCount == 0 && Events.Count == 0 && DeadLetters.Count == 0;

    /// <summary>Adds one sample.</summary>
    public void AddSample(in SampleRow sample)
    {
        if (SampleCount == _samples.Length)
        {
            Array.Resize(ref _samples, _samples.Length * 2);
            Array.Resize(ref _inserted, _samples.Length);
        }
        _samples[SampleCount] = sample;
        _inserted[SampleCount] = false;
        SampleCount++;
    }

    /// <summary>Drops samples added after the first <paramref name="count"/> (used to undo a partly parsed message).</summary>
    public void TruncateSamples(int count)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(count);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(count, SampleCount);
        SampleCount = count;
    }

    /// <summary>Empties the batch for reuse.</summary>
    public void Clear()
    {
        SampleCount = 0;
        Events.Clear();
        DeadLetters.Clear();
    }
}
