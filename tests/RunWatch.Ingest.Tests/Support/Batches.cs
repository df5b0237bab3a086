using RunWatch.Storage;

namespace RunWatch.Ingest.Tests.Support;

/// <summary>Committed-looking batches for observers: every sample marked as newly inserted.</summary>
internal static class Batches
{
    public static readonly DateTimeOffset T0 = new(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);

    /// <summary>Channel ids of <see cref="TestChambers"/>: 10 temperature, 11 setpoint, 12 shutter.</summary>
    public static IngestBatch Of(params (double Seconds, long ChannelId, double Value)[] samples)
    {
        var batch = new IngestBatch(Math.Max(1, samples.Length));
        foreach (var (seconds, channel, value) in samples)
        {
            batch.AddSample(new SampleRow(1, channel, UnixMicros.From(T0.AddSeconds(seconds)), SampleRow.NoSeq, value));
        }
        batch.InsertedForWrite.Fill(true);
        return batch;
    }
}
