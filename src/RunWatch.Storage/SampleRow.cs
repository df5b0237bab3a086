namespace RunWatch.Storage;

/// <summary>One telemetry sample ready to store. Its identity is (chamber, channel, timestamp, seq).</summary>
/// <param name="ChamberId">Store id of the chamber.</param>
/// <param name="ChannelId">Store id of the channel.</param>
/// <param name="TimestampUs">Sample time, microseconds since the Unix epoch (UTC).</param>
/// <param name="Seq">Publisher's sequence number, or <see cref="NoSeq"/>.</param>
/// <param name="Value">Value as published (not calibrated), in the channel's unit.</param>
public readonly record struct SampleRow(long ChamberId, long ChannelId, long TimestampUs, long Seq, double Value)
{
    /// <summary>Seq stored when the publisher sent none.</summary>
    public const long NoSeq = -1;
}
