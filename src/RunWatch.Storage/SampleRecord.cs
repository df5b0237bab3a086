namespace RunWatch.Storage;

/// <summary>A stored sample of one channel, as read back.</summary>
/// <param name="Timestamp">Sample time (UTC).</param>
/// <param name="Seq">Publisher's sequence number, or <see cref="SampleRow.NoSeq"/>.</param>
/// <param name="Value">Value as published (not calibrated).</param>
public readonly record struct SampleRecord(DateTimeOffset Timestamp, long Seq, double Value);
