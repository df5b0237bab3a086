using System.Text;
using RunWatch.Ingest.Chambers;
using RunWatch.Ingest.Configuration;
using RunWatch.Ingest.Parsing;
using RunWatch.Ingest.Tests.Support;
using RunWatch.Storage;

namespace RunWatch.Ingest.Tests.Parsing;

public sealed class MessageParserTests
{
    private static readonly DateTimeOffset Now = new(2026, 3, 4, 10, 0, 1, TimeSpan.Zero);
    private const string Telemetry = "runwatch/lab/C1/telemetry";

    private readonly IngestBatch _batch = new(4);
    private readonly List<ChamberEvent> _events = [];
    private readonly RejectTally _tally = new();
    private readonly MessageParser _parser = new(TestChambers.Registry(), new IngestOptions { MaxPayloadBytes = 1024 });

    [Fact]
    public void Parse_TelemetryObject_AddsOneSamplePerChannelWithTimeAndSeq()
    {
        int added = Parse(Telemetry, """{"t":"2026-03-04T10:00:00.125Z","seq":1234,"values":{"substrate_tc":612.3,"substrate_sp":610,"ga_shutter":1}}""");

        Assert.Equal(3, added);
        var s = _batch.Samples.ToArray();
        Assert.Equal(UnixMicros.From(new DateTimeOffset(2026, 3, 4, 10, 0, 0, 125, TimeSpan.Zero)), s[0].TimestampUs);
        Assert.All(s, x => Assert.Equal(1234, x.Seq));
        Assert.Equal(new[] { 612.3, 610, 1 }, s.Select(x => x.Value).ToArray());
        Assert.Equal(new long[] { 10, 11, 12 }, s.Select(x => x.ChannelId).ToArray());
        Assert.Equal(0, _tally.Total);
        Assert.Empty(_batch.DeadLetters);
    }

    [Fact]
    public void Parse_ValuesBeforeTime_StillUsesTheObjectsTime()
    {
        Parse(Telemetry, """{"values":{"substrate_tc":600},"seq":5,"t":"2026-03-04T11:00:00+01:00"}""");

        var sample = Assert.Single(_batch.Samples.ToArray());
        Assert.Equal(UnixMicros.From(new DateTimeOffset(2026, 3, 4, 10, 0, 0, TimeSpan.Zero)), sample.TimestampUs);
        Assert.Equal(5, sample.Seq);
    }

    [Fact]
    public void Parse_TelemetryArray_AddsEveryObjectAndIgnoresUnknownProperties()
    {
        int added = Parse(Telemetry, """
            [{"t":"2026-03-04T10:00:00Z","seq":1,"values":{"substrate_tc":600},"extra":{"a":[1,2]}},
             {"t":"2026-03-04T10:00:01Z","seq":2,"values":{"substrate_tc":601,"ga_shutter":0}}]
            """);

        Assert.Equal(3, added);
        Assert.Equal(0, _tally.Total);
    }

    [Fact]
    public void Parse_NoSeq_StoresNoSeqMarker()
    {
        Parse(Telemetry, """{"t":"2026-03-04T10:00:00Z","values":{"substrate_tc":600}}""");
        Assert.Equal(SampleRow.NoSeq, Assert.Single(_batch.Samples.ToArray()).Seq);
    }

    [Theory]
    [InlineData("612.3", 612.3)]
    [InlineData(" 612 \n", 612.0)]
    [InlineData("6.1e2", 610.0)]
    public void Parse_BareNumberOnChannelTopic_UsesArrivalTime(string payload, double expected)
    {
        Parse("runwatch/lab/C1/ch/substrate_tc", payload);

        var sample = Assert.Single(_batch.Samples.ToArray());
        Assert.Equal(expected, sample.Value);
        Assert.Equal(UnixMicros.From(Now), sample.TimestampUs);
        Assert.Equal(SampleRow.NoSeq, sample.Seq);
    }

    [Fact]
    public void Parse_TimeValueObjectOnChannelTopic_UsesItsTime()
    {
        Parse("runwatch/lab/C1/ch/substrate_sp", """{"t":"2026-03-04T10:00:00.5Z","v":610,"seq":9}""");

        var sample = Assert.Single(_batch.Samples.ToArray());
        Assert.Equal(11, sample.ChannelId);
        Assert.Equal(9, sample.Seq);
        Assert.Equal(UnixMicros.From(new DateTimeOffset(2026, 3, 4, 10, 0, 0, 500, TimeSpan.Zero)), sample.TimestampUs);
    }

    [Theory]
    [InlineData(Telemetry, """{"t":"2026-03-04T10:00:00Z","values":{"substrate_tc":600""", "malformed_json")]
    [InlineData(Telemetry, """{"t":"2026-03-04T10:00:00Z","values":{"substrate_tc":600}} trailing""", "malformed_json")]
    [InlineData(Telemetry, "", "malformed_json")]
    [InlineData(Telemetry, "not json", "malformed_json")]
    [InlineData(Telemetry, """{"t":"2026-03-04T10:00:00Z","values":{"substrate_tc":NaN}}""", "malformed_json")]
    [InlineData(Telemetry, "42", "wrong_type")]
    [InlineData(Telemetry, """{"t":1700000000,"values":{"substrate_tc":600}}""", "wrong_type")]
    [InlineData(Telemetry, """{"t":"2026-03-04T10:00:00Z","seq":-3,"values":{"substrate_tc":600}}""", "wrong_type")]
    [InlineData(Telemetry, """{"t":"2026-03-04T10:00:00Z","seq":1.5,"values":{"substrate_tc":600}}""", "wrong_type")]
    [InlineData("runwatch/lab/C1/ch/substrate_tc", """{"t":"2026-03-04T10:00:00Z","seq":-3,"v":600}""", "wrong_type")]
    [InlineData("runwatch/lab/C1/ch/substrate_tc", """{"t":"2026-03-04T10:00:00Z","seq":"7","v":600}""", "wrong_type")]
    [InlineData(Telemetry, """{"t":"2026-03-04T10:00:00Z","values":[600]}""", "wrong_type")]
    [InlineData(Telemetry, """{"t":"2026-03-04T10:00:00Z","values":{"substrate_tc":"600"}}""", "wrong_type")]
    [InlineData(Telemetry, """{"t":"2026-03-04T10:00:00Z","values":{"substrate_tc":true}}""", "wrong_type")]
    [InlineData(Telemetry, """{"t":"2026-03-04T10:00:00Z","values":{"substrate_tc":null}}""", "wrong_type")]
    [InlineData(Telemetry, """{"t":"2026-03-04T10:00:00Z","values":{"substrate_tc":1e999}}""", "not_finite")]
    [InlineData(Telemetry, """{"t":"2026-03-04T10:00:00Z","values":{"substrate_tc":1300}}""", "out_of_range")]
    [InlineData(Telemetry, """{"t":"2026-03-04T10:00:00Z","values":{"ga_shutter":-0.1}}""", "out_of_range")]
    [InlineData(Telemetry, """{"t":"2026-03-04T10:00:00Z","values":{"mystery":1}}""", "unknown_channel")]
    [InlineData("runwatch/lab/C9/telemetry", """{"t":"2026-03-04T10:00:00Z","values":{"substrate_tc":600}}""", "unknown_chamber")]
    [InlineData("runwatch/other-site/C1/telemetry", """{"t":"2026-03-04T10:00:00Z","values":{"substrate_tc":600}}""", "unknown_chamber")]
    [InlineData("runwatch/lab/C1/telemetry/extra", "1", "unknown_topic")]
    [InlineData("elsewhere/lab/C1/telemetry", "1", "unknown_topic")]
    [InlineData(Telemetry, """{"values":{"substrate_tc":600}}""", "missing_field")]
    [InlineData(Telemetry, """{"t":"2026-03-04T10:00:00Z"}""", "missing_field")]
    [InlineData(Telemetry, """{"t":"yesterday","values":{"substrate_tc":600}}""", "bad_timestamp")]
    [InlineData(Telemetry, """{"t":"2026-03-04T10:00:00","values":{"substrate_tc":600}}""", "bad_timestamp")]
    [InlineData(Telemetry, """{"t":"2026-03-04T10:10:00Z","values":{"substrate_tc":600}}""", "timestamp_future")]
    [InlineData(Telemetry, """{"t":"2025-01-01T00:00:00Z","values":{"substrate_tc":600}}""", "timestamp_too_old")]
    [InlineData("runwatch/lab/C1/ch/substrate_tc", "NaN", "not_finite")]
    [InlineData("runwatch/lab/C1/ch/substrate_tc", "-Infinity", "not_finite")]
    [InlineData("runwatch/lab/C1/ch/substrate_tc", "\"612\"", "wrong_type")]
    [InlineData("runwatch/lab/C1/ch/substrate_tc", "12,5", "malformed_json")]
    [InlineData("runwatch/lab/C1/ch/substrate_tc", """{"t":"2026-03-04T10:00:00Z"}""", "missing_field")]
    [InlineData("runwatch/lab/C1/ch/substrate_tc", """{"v":"hot"}""", "wrong_type")]
    [InlineData("runwatch/lab/C1/ch/nothing", "1", "unknown_channel")]
    [InlineData("runwatch/lab/C1/event", """{"t":"2026-03-04T10:00:00Z","type":"explode"}""", "unknown_event_type")]
    [InlineData("runwatch/lab/C1/event", """{"t":"2026-03-04T10:00:00Z"}""", "missing_field")]
    [InlineData("runwatch/lab/C1/event", """{"t":"2026-03-04T10:00:00Z","type":"run-start","wafers":"W1"}""", "wrong_type")]
    [InlineData("runwatch/lab/C1/event", """{"t":"2026-03-04T10:00:00Z","type":"run-start","planned_s":-5}""", "out_of_range")]
    [InlineData("runwatch/lab/C1/event", """{"t":"2026-03-04T10:00:00Z","type":"run-start""", "malformed_json")]
    public void Parse_BadInput_RejectsWithReasonAndKeepsDeadLetter(string topic, string payload, string reason)
    {
        int added = Parse(topic, payload);

        Assert.Equal(0, added);
        Assert.Empty(_events);
        Assert.True(_tally.Total >= 1);
        var letter = Assert.Single(_batch.DeadLetters);
        Assert.Equal(reason, letter.Reason);
        Assert.Equal(topic, letter.Topic);
        Assert.Equal(Encoding.UTF8.GetByteCount(payload), letter.PayloadLength);
        Assert.False(string.IsNullOrEmpty(letter.Detail));
    }

    [Fact]
    public void Parse_OversizePayload_RejectedWithoutParsing()
    {
        byte[] head = Encoding.UTF8.GetBytes("{\"t\":");
        _parser.Parse(Telemetry, head, 5000, Now, _batch, _events, _tally);

        Assert.Equal(1, _tally[RejectReason.Oversize]);
        Assert.Equal(5000, Assert.Single(_batch.DeadLetters).PayloadLength);
        Assert.Equal(0, _batch.SampleCount);
    }

    [Fact]
    public void Parse_MixedValidAndInvalidValues_KeepsTheValidOnesAndCountsEachReject()
    {
        int added = Parse(Telemetry, """
            [{"t":"2026-03-04T10:00:00Z","values":{"substrate_tc":600,"substrate_sp":"x","mystery":3,"ga_shutter":7}},
             {"t":"bad","values":{"substrate_tc":601}},
             5,
             {"t":"2026-03-04T10:00:01Z","values":{"substrate_tc":602}}]
            """);

        Assert.Equal(2, added);
        Assert.Equal(new[] { 600.0, 602.0 }, _batch.Samples.ToArray().Select(s => s.Value).ToArray());
        Assert.Equal(2, _tally[RejectReason.WrongType]);
        Assert.Equal(1, _tally[RejectReason.UnknownChannel]);
        Assert.Equal(1, _tally[RejectReason.OutOfRange]);
        Assert.Equal(1, _tally[RejectReason.BadTimestamp]);
        Assert.Single(_batch.DeadLetters);
    }

    [Fact]
    public void Parse_MalformedAfterValidObjects_DropsTheWholeMessage()
    {
        int added = Parse(Telemetry, """[{"t":"2026-03-04T10:00:00Z","values":{"substrate_tc":600}},{"t":""");

        Assert.Equal(0, added);
        Assert.Equal(0, _batch.SampleCount);
        Assert.Equal(1, _tally[RejectReason.MalformedJson]);
        Assert.Equal(1, _tally.Total);
    }

    [Fact]
    public void Parse_RunStartEvent_ParsesEveryField()
    {
        Parse("runwatch/lab/C1/event", """
            {"t":"2026-03-04T10:00:00Z","type":"run-start","run":"R0412","wafers":["W-0412-A","W-0412-B"],
             "recipe":"nw-gaas-std","setpoint_c":610,"planned_s":1800}
            """);

        var e = Assert.Single(_events);
        Assert.Equal("run-start", e.Type);
        Assert.Equal("R0412", e.RunName);
        Assert.Equal(["W-0412-A", "W-0412-B"], e.Wafers);
        Assert.Equal("nw-gaas-std", e.Recipe);
        Assert.Equal(610, e.SetpointC);
        Assert.Equal(1800, e.PlannedSeconds);
        var stored = Assert.Single(_batch.Events);
        Assert.Equal("R0412", stored.RunName);
        Assert.Contains("nw-gaas-std", stored.PayloadJson, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("""{"t":"2026-03-04T10:30:00Z","type":"run-end","run":"R0412"}""", "run-end", null)]
    [InlineData("""{"t":"2026-03-04T10:05:00Z","type":"step","step":"anneal"}""", "step", "anneal")]
    [InlineData("""{"t":"2026-03-04T10:06:00Z","type":"note","text":"pyrometer window coated"}""", "note", "pyrometer window coated")]
    public void Parse_OtherEvents_Parsed(string payload, string type, string? text)
    {
        var receivedAt = new DateTimeOffset(2026, 3, 4, 10, 30, 1, TimeSpan.Zero);
        _parser.Parse("runwatch/lab/C1/event", Encoding.UTF8.GetBytes(payload), Encoding.UTF8.GetByteCount(payload), receivedAt, _batch, _events, _tally);

        var e = Assert.Single(_events);
        Assert.Equal(type, e.Type);
        Assert.Equal(text, e.Text);
        Assert.Equal(0, _tally.Total);
    }

    [Theory]
    [InlineData("2026-03-04T10:00:00Z", true)]
    [InlineData("2026-03-04T10:00:00.125+02:00", true)]
    [InlineData("2026-03-04T10:00:00-05:00", true)]
    [InlineData("2026-03-04T10:00:00", false)]
    [InlineData("2026-03-04", false)]
    public void HasExplicitOffset_Forms_Detected(string text, bool expected) =>
        Assert.Equal(expected, MessageParser.HasExplicitOffset(Encoding.UTF8.GetBytes(text)));

    private int Parse(string topic, string payload)
    {
        byte[] bytes = Encoding.UTF8.GetBytes(payload);
        return _parser.Parse(topic, bytes, bytes.Length, Now, _batch, _events, _tally);
    }
}
