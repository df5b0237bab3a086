using System.Text;
using RunWatch.Ingest.Chambers;
using RunWatch.Ingest.Configuration;
using RunWatch.Ingest.Parsing;
using RunWatch.Ingest.Tests.Support;
using RunWatch.Storage;

namespace RunWatch.Ingest.Tests.Parsing;

/// <summary>What a faulty gateway sends: invalid UTF-8, repeated keys, empty messages, a run-start without its id.</summary>
public sealed class MessageParserHardeningTests
{
    private static readonly DateTimeOffset Now = new(2026, 3, 4, 10, 0, 1, TimeSpan.Zero);
    private const string Telemetry = "runwatch/lab/C1/telemetry";
    private const string Event = "runwatch/lab/C1/event";

    private readonly IngestBatch _batch = new(4);
    private readonly List<ChamberEvent> _events = [];
    private readonly RejectTally _tally = new();
    private readonly MessageParser _parser = new(TestChambers.Registry(), new IngestOptions { MaxPayloadBytes = 4096 });

    [Fact]
    public void Parse_InvalidUtf8InAnUnknownChannelName_MalformedUtf8AndTheValidValueKept()
    {
        byte[] payload = Bytes("{\"t\":\"2026-03-04T10:00:00Z\",\"values\":{\"substrate_tc\":612.5,\"", [0xFF, 0xFE], "\":1}}");

        int added = _parser.Parse(Telemetry, payload, payload.Length, Now, _batch, _events, _tally);

        Assert.Equal(1, added);
        Assert.Equal(612.5, Assert.Single(_batch.Samples.ToArray()).Value);
        Assert.Equal(1, _tally[RejectReason.MalformedUtf8]);
        Assert.Equal(0, _tally[RejectReason.ParserFault]);
        var dead = Assert.Single(_batch.DeadLetters);
        Assert.Contains("malformed_utf8 x1: payload is not valid UTF-8", dead.Detail, StringComparison.Ordinal);
    }

    [Fact]
    public void Parse_InvalidUtf8InAnEvent_RejectedAsMalformedWithoutThrowing()
    {
        byte[] payload = Bytes("{\"t\":\"2026-03-04T10:00:00Z\",\"type\":\"note\",\"text\":\"", [0xC3, 0x28], "\"}");

        _parser.Parse(Event, payload, payload.Length, Now, _batch, _events, _tally);

        Assert.Empty(_events);
        Assert.Equal(1, _tally[RejectReason.MalformedUtf8]);
    }

    [Theory]
    [InlineData(Event, """{"t":"2026-03-04T10:00:00Z","type":"note","text":"\udc00"}""")]
    [InlineData(Telemetry, """{"t":"2026-03-04T10:00:00Z","values":{"\udc00":1}}""")]
    [InlineData(Telemetry, """{"t":"2026-03-04T10:00:00\udc00Z","values":{"substrate_tc":1}}""")]
    [InlineData("runwatch/lab/C1/ch/substrate_tc", """{"t":"\udc00","v":1}""")]
    public void Parse_EscapedLoneSurrogate_NeverAParserFault(string topic, string json)
    {
        Parse(topic, json);
        Assert.Equal(0, _tally[RejectReason.ParserFault]);
        Assert.True(_tally.Total > 0);
    }

    [Theory]
    [InlineData("""{"t":"2026-03-04T10:00:00Z","t":"2026-03-04T09:00:00Z","values":{"substrate_tc":600}}""")]
    [InlineData("""{"t":"2026-03-04T10:00:00Z","seq":1,"seq":2,"values":{"substrate_tc":600}}""")]
    [InlineData("""{"t":"2026-03-04T10:00:00Z","values":{"substrate_tc":600},"values":{"substrate_tc":700}}""")]
    [InlineData("""{"t":"2026-03-04T10:00:00Z","values":{"substrate_tc":600,"substrate_tc":700}}""")]
    [InlineData("""{"t":"2026-03-04T10:00:00Z","values":{"substrate_tc":600,"substrate\u005ftc":700}}""")]
    [InlineData("""{"\u0074":"2026-03-04T10:00:00Z","t":"2026-03-04T10:00:00Z","values":{"substrate_tc":600}}""")]
    public void Parse_TelemetryKeyTwice_RejectedAsAmbiguousNothingStored(string json)
    {
        int added = Parse(Telemetry, json);

        Assert.Equal(0, added);
        Assert.Equal(1, _tally[RejectReason.DuplicateKey]);
        Assert.Equal("duplicate_key", Assert.Single(_batch.DeadLetters).Reason);
    }

    [Fact]
    public void Parse_DuplicateOnlyInOneObjectOfAnArray_OtherObjectsKept()
    {
        int added = Parse(Telemetry, """
            [{"t":"2026-03-04T10:00:00Z","values":{"substrate_tc":600,"substrate_tc":601}},
             {"t":"2026-03-04T10:00:00.5Z","values":{"substrate_tc":602}}]
            """);

        Assert.Equal(1, added);
        Assert.Equal(602, Assert.Single(_batch.Samples.ToArray()).Value);
        Assert.Equal(1, _tally[RejectReason.DuplicateKey]);
    }

    [Theory]
    [InlineData("""{"t":"2026-03-04T10:00:00Z","v":600,"v":700}""")]
    [InlineData("""{"t":"2026-03-04T10:00:00Z","t":"2026-03-04T10:00:00Z","v":600}""")]
    public void Parse_ChannelObjectKeyTwice_RejectedAsAmbiguous(string json)
    {
        Assert.Equal(0, Parse("runwatch/lab/C1/ch/substrate_tc", json));
        Assert.Equal(1, _tally[RejectReason.DuplicateKey]);
    }

    [Fact]
    public void Parse_EventKeyTwice_RejectedAsAmbiguous()
    {
        Parse(Event, """{"t":"2026-03-04T10:00:00Z","type":"run-start","run":"R1","run":"R2"}""");

        Assert.Empty(_events);
        Assert.Equal(1, _tally[RejectReason.DuplicateKey]);
    }

    [Theory]
    [InlineData("[]")]
    [InlineData(" [ ] ")]
    [InlineData("""{"t":"2026-03-04T10:00:00Z","values":{}}""")]
    public void Parse_NothingToStore_CountedAsEmpty(string json)
    {
        Assert.Equal(0, Parse(Telemetry, json));
        Assert.Equal(1, _tally[RejectReason.Empty]);
        Assert.Equal("empty", Assert.Single(_batch.DeadLetters).Reason);
    }

    [Fact]
    public void Parse_RunStartWithoutRunId_KeptAndCountedWithoutDeadLetter()
    {
        Parse(Event, """{"t":"2026-03-04T10:00:00Z","type":"run-start","recipe":"nw-inv"}""");

        var started = Assert.Single(_events);
        Assert.Null(started.RunName);
        Assert.Equal(1, _tally[RejectReason.RunStartWithoutId]);
        Assert.Empty(_batch.DeadLetters);
    }

    [Fact]
    public void Parse_RunStartWithRunId_NotCounted()
    {
        Parse(Event, """{"t":"2026-03-04T10:00:00Z","type":"run-start","run":"R-INV-1"}""");
        Assert.Single(_events);
        Assert.Equal(0, _tally.Total);
    }

    private static byte[] Bytes(string before, byte[] raw, string after) => [.. Encoding.UTF8.GetBytes(before), .. raw, .. Encoding.UTF8.GetBytes(after)];

    private int Parse(string topic, string payload)
    {
        byte[] bytes = Encoding.UTF8.GetBytes(payload);
        return _parser.Parse(topic, bytes, bytes.Length, Now, _batch, _events, _tally);
    }
}
