using System.Globalization;
using System.Text.Json;
using RunWatch.Ingest.Chambers;
using RunWatch.Storage;

namespace RunWatch.Ingest.Parsing;

/// <summary>One-value-per-topic telemetry: <c>612.3</c> or <c>{"t":"…","v":612.3}</c> (optionally with <c>"seq"</c>).</summary>
internal sealed partial class MessageParser
{
    private void ParseChannelValue(ReadOnlySpan<byte> payload, ChamberRuntime chamber, ReadOnlySpan<char> channelName, DateTimeOffset receivedAt, IngestBatch batch)
    {
        var channel = chamber.FindChannel(channelName);
        if (channel is null)
        {
            Reject(RejectReason.UnknownChannel, "channel not configured: " + channelName.ToString());
            return;
        }
        var text = payload.Trim(" \t\r\n"u8);
        if (text.IsEmpty)
        {
            Reject(RejectReason.MalformedJson, "empty payload");
            return;
        }
        if (text[0] == (byte)'{')
        {
            ParseChannelObject(text, chamber, channel, receivedAt, batch);
            return;
        }
        // A bare number. double.TryParse also reads NaN and Infinity, which gateways do send; those are rejected as not finite.
        if (double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out double value))
        {
            if (CheckTime(receivedAt, receivedAt, out long us))
            {
                AddChecked(value, chamber, channel, us, SampleRow.NoSeq, batch);
            }
            return;
        }
        if (text[0] is (byte)'"' or (byte)'[' || text.SequenceEqual("true"u8) || text.SequenceEqual("false"u8) || text.SequenceEqual("null"u8))
        {
            Reject(RejectReason.WrongType, channel.Name + ": value must be a number");
            return;
        }
        Reject(RejectReason.MalformedJson, channel.Name + ": payload is neither a number nor a JSON object");
    }

    private void ParseChannelObject(ReadOnlySpan<byte> payload, ChamberRuntime chamber, ChannelRuntime channel, DateTimeOffset receivedAt, IngestBatch batch)
    {
        var reader = new Utf8JsonReader(payload, ReaderOptions);
        reader.Read();
        long timestampUs = UnixMicros.From(receivedAt);
        long seq = SampleRow.NoSeq;
        bool invalid = false;
        bool haveValue = false;
        Utf8JsonReader valueReader = default;
        bool sawTime = false;
        bool sawSeq = false;
        while (reader.Read() && reader.TokenType != JsonTokenType.EndObject)
        {
            if (IsRepeat(ref reader, ref sawTime, "t"u8) || IsRepeat(ref reader, ref sawSeq, "seq"u8) || IsRepeatOf(ref reader, haveValue, "v"u8))
            {
                Reject(RejectReason.DuplicateKey, channel.Name + ": property " + Printable(ref reader) + " appears twice");
                invalid = true;
                reader.Read();
                reader.Skip();
            }
            else if (reader.ValueTextEquals("t"u8))
            {
                reader.Read();
                invalid |= !TryReadTimestamp(ref reader, receivedAt, out timestampUs);
            }
            else if (reader.ValueTextEquals("seq"u8))
            {
                invalid |= !TryReadSeq(ref reader, ref seq);
            }
            else if (reader.ValueTextEquals("v"u8))
            {
                reader.Read();
                valueReader = reader;
                haveValue = true;
                reader.Skip();
            }
            else
            {
                reader.Read();
                reader.Skip();
            }
        }
        EnsureEnd(ref reader);
        if (invalid)
        {
            return;
        }
        if (!haveValue)
        {
            Reject(RejectReason.MissingField, channel.Name + ": object without v");
            return;
        }
        AddValue(ref valueReader, chamber, channel, timestampUs, seq, batch);
    }
}
