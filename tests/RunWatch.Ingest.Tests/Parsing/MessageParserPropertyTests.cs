using CsCheck;
using RunWatch.Testing.Fuzzing;
using RunWatch.Ingest.Chambers;
using RunWatch.Ingest.Configuration;
using RunWatch.Ingest.Parsing;
using RunWatch.Ingest.Tests.Support;
using RunWatch.Storage;

namespace RunWatch.Ingest.Tests.Parsing;

/// <summary>
/// Property-based fuzzing of the telemetry parser with CsCheck: the committed corpus (Parsing/Corpus, one payload per
/// file, the topic from the file name) mutated by byte flips, insertions and cuts, plus plain random bytes. For every
/// input the parser must not throw and must keep its accounting: samples only for configured channels, finite and in
/// range; at most one dead letter per message, and one whenever something was lost. Runs for
/// <see cref="Fuzz.Seconds"/> per target (RUNWATCH_FUZZ_SECONDS, default 10; longer by hand). A failure prints a
/// CsCheck seed to replay with <c>CsCheck_Seed</c>.
/// </summary>
public sealed class MessageParserPropertyTests
{
    private static readonly DateTimeOffset Now = new(2026, 3, 4, 10, 0, 1, TimeSpan.Zero);

    private static readonly (string Topic, byte[] Payload)[] Corpus = [.. Directory.GetFiles(Path.Combine(AppContext.BaseDirectory, "Parsing", "Corpus"))
        .Order(StringComparer.Ordinal)
        .Select(f => (TopicFor(Path.GetFileName(f)), File.ReadAllBytes(f)))];

    [Fact]
    public void Corpus_IsThere()
    {
        Assert.True(Corpus.Length >= 5, "the committed fuzz corpus is missing from the test output");
    }

    [Fact]
    public void Parse_MutatedCorpus_NeverThrowsAndKeepsItsAccounts()
    {
        var gen = Gen.Select(Gen.Int[0, Corpus.Length - 1], Fuzz.Mutations, (i, m) => (Corpus[i].Topic, Fuzz.Apply(Corpus[i].Payload, m)));
        gen.Sample(input => Check(input.Topic, input.Item2), time: Fuzz.Seconds, threads: 1);
    }

    [Fact]
    public void Parse_RandomBytes_NeverThrows()
    {
        string[] topics = ["runwatch/lab/C1/telemetry", "runwatch/lab/C1/event", "runwatch/lab/C1/ch/substrate_tc"];
        Gen.Select(Gen.Int[0, topics.Length - 1], Gen.Byte.Array[0, 300])
            .Sample(input => Check(topics[input.Item1], input.Item2), time: Fuzz.Seconds, threads: 1);
    }

    private static void Check(string topic, byte[] payload)
    {
        var registry = TestChambers.Registry();
        var parser = new MessageParser(registry, new IngestOptions { MaxPayloadBytes = 4096 });
        var batch = new IngestBatch(4);
        var events = new List<ChamberEvent>();
        var tally = new RejectTally();

        int added = parser.Parse(topic, payload, payload.Length, Now, batch, events, tally);

        Assert.Equal(batch.SampleCount, added);
        Assert.InRange(batch.DeadLetters.Count, 0, 1);
        Assert.Equal(0, tally[RejectReason.ParserFault]);
        long lost = tally.Total - tally[RejectReason.RunStartWithoutId];
        Assert.Equal(lost > 0 ? 1 : 0, batch.DeadLetters.Count);
        var chamber = registry.Find("C1".AsSpan())!;
        foreach (var sample in batch.Samples.ToArray())
        {
            var channel = chamber.FindChannel(sample.ChannelId);
            Assert.NotNull(channel);
            Assert.True(double.IsFinite(sample.Value));
            Assert.InRange(sample.Value, channel.Min, channel.Max);
        }
    }

    private static string TopicFor(string file) => file.Split('-')[0] switch
    {
        "telemetry" => "runwatch/lab/C1/telemetry",
        "event" => "runwatch/lab/C1/event",
        _ => "runwatch/lab/C1/ch/substrate_tc",
    };
}
