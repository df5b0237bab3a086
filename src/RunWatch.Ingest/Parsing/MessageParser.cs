using System.Globalization;
using System.Text;
using System.Text.Json;
using System.Text.Unicode;
using RunWatch.Ingest.Chambers;
using RunWatch.Ingest.Configuration;
using RunWatch.Storage;

namespace RunWatch.Ingest.Parsing;

/// <summary>
/// Turns one MQTT message into samples, events and, for anything rejected, one dead letter. Telemetry is read with
/// <see cref="Utf8JsonReader"/> straight from the payload bytes: no string per message or per value. Valid values of a
/// message are kept even when others in it are rejected; a message that is not well-formed JSON is rejected whole.
/// Used by the single ingest consumer only (it keeps scratch state); never throws on input.
/// </summary>
internal sealed partial class MessageParser
{
    private static readonly JsonReaderOptions ReaderOptions = new() { CommentHandling = JsonCommentHandling.Disallow, MaxDepth = 16 };

    private readonly ChamberRegistry _registry;
    private readonly IngestOptions _options;
    private readonly int _deadLetterPayloadBytes;
    private readonly RejectTally _message = new();

    public MessageParser(ChamberRegistry registry, IngestOptions options, int deadLetterPayloadBytes = 4096)
    {
        _registry = registry;
        _options = options;
        _deadLetterPayloadBytes = deadLetterPayloadBytes;
    }

    /// <summary>Parses one message into <paramref name="batch"/> and <paramref name="events"/>; adds its rejects to <paramref name="tally"/>.</summary>
    /// <param name="topic">MQTT topic.</param>
    /// <param name="payload">Payload bytes (possibly cut short when <paramref name="payloadLength"/> exceeds the size limit).</param>
    /// <param name="payloadLength">Length of the payload as received.</param>
    /// <param name="receivedAt">Arrival time, used for samples without their own time and for the time checks.</param>
    /// <param name="batch">Receives samples and dead letters.</param>
    /// <param name="events">Receives parsed events (they are also added to the batch for storing).</param>
    /// <param name="tally">Receives reject counts.</param>
    /// <returns>Samples added.</returns>
    public int Parse(string topic, ReadOnlySpan<byte> payload, int payloadLength, DateTimeOffset receivedAt, IngestBatch batch, List<ChamberEvent> events, RejectTally tally)
    {
        _message.Clear();
        int samplesBefore = batch.SampleCount;
        int eventsBefore = events.Count;
        int storedEventsBefore = batch.Events.Count;
        try
        {
            var parts = TopicParts.Parse(topic, _options.TopicRoot);
            if (payloadLength > _options.MaxPayloadBytes)
            {
                Reject(RejectReason.Oversize, "payload of " + payloadLength.ToString(CultureInfo.InvariantCulture) + " bytes exceeds " + _options.MaxPayloadBytes.ToString(CultureInfo.InvariantCulture));
            }
            else if (parts.Kind == TopicKind.Unknown)
            {
                Reject(RejectReason.UnknownTopic, "topic does not match the contract");
            }
            else if (_registry.Find(parts.Chamber) is not { } chamber || !parts.Site.SequenceEqual(chamber.Site))
            {
                Reject(RejectReason.UnknownChamber, "chamber not configured: " + parts.Site.ToString() + "/" + parts.Chamber.ToString());
            }
            else if (!Utf8.IsValid(payload) && RejectInvalidUtf8(payload) && parts.Kind == TopicKind.Event)
            {
                // An event is kept whole or not at all; telemetry keeps the values that can still be read.
            }
            else
            {
                switch (parts.Kind)
                {
                    case TopicKind.Telemetry:
                        ParseTelemetry(payload, chamber, receivedAt, batch);
                        break;
                    case TopicKind.Channel:
                        ParseChannelValue(payload, chamber, parts.Channel, receivedAt, batch);
                        break;
                    default:
                        ParseEvent(payload, chamber, receivedAt, batch, events);
                        break;
                }
            }
        }
        catch (JsonException ex)
        {
            // Not well-formed: nothing of this message is kept, and earlier per-value rejects are superseded.
            batch.TruncateSamples(samplesBefore);
            events.RemoveRange(eventsBefore, events.Count - eventsBefore);
            batch.Events.RemoveRange(storedEventsBefore, batch.Events.Count - storedEventsBefore);
            _message.Clear();
            Reject(RejectReason.MalformedJson, "not well-formed JSON: " + ex.Message);
        }

        if (_message.Total > 0)
        {
            bool lostSomething = false;
            for (int r = 0; r < RejectReasons.Count; r++)
            {
                var reason = (RejectReason)r;
                long count = _message[reason];
                if (count > 0)
                {
                    tally.Add(reason, _message.FirstDetail(reason), count);
                    lostSomething |= !RejectReasons.IsNotice(reason);
                }
            }
            if (lostSomething)
            {
                var firstReason = FirstReason();
                int kept = Math.Min(payload.Length, _deadLetterPayloadBytes);
                batch.DeadLetters.Add(new DeadLetter(receivedAt, topic, RejectReasons.Code(firstReason),
                    Summary(), payload[..kept].ToArray(), payloadLength));
            }
        }
        return batch.SampleCount - samplesBefore;
    }

    private RejectReason FirstReason()
    {
        for (int r = 0; r < RejectReasons.Count; r++)
        {
            if (_message[(RejectReason)r] > 0 && !RejectReasons.IsNotice((RejectReason)r))
            {
                return (RejectReason)r;
            }
        }
        return RejectReason.MalformedJson;
    }

    private string Summary()
    {
        var text = new StringBuilder();
        for (int r = 0; r < RejectReasons.Count; r++)
        {
            var reason = (RejectReason)r;
            if (_message[reason] == 0)
            {
                continue;
            }
            if (text.Length > 0)
            {
                text.Append("; ");
            }
            text.Append(RejectReasons.Code(reason)).Append(" x").Append(_message[reason].ToString(CultureInfo.InvariantCulture))
                .Append(": ").Append(_message.FirstDetail(reason));
        }
        return text.ToString();
    }

    private void Reject(RejectReason reason, string detail) => _message.Add(reason, detail);

    /// <summary>Counts the message as malformed UTF-8 (once) and returns true.</summary>
    private bool RejectInvalidUtf8(ReadOnlySpan<byte> payload)
    {
        int offset = 0;
        while (offset < payload.Length && Utf8.IsValid(payload[..(offset + 1)]))
        {
            offset++;
        }
        // A cut multi-byte sequence is valid as a prefix of nothing; the first offset whose prefix fails is the bad byte.
        Reject(RejectReason.MalformedUtf8, "payload is not valid UTF-8 (near byte " + offset.ToString(CultureInfo.InvariantCulture) + ")");
        return true;
    }

    /// <summary>A property name or string for a log line or dead letter: never throws, invalid bytes become U+FFFD, at most 64 characters.</summary>
    private static string Printable(ref Utf8JsonReader reader)
    {
        string text;
        if (reader.ValueIsEscaped)
        {
            try
            {
                text = reader.GetString() ?? "";
            }
            catch (InvalidOperationException)
            {
                text = "(not valid Unicode)";
            }
        }
        else
        {
            text = Encoding.UTF8.GetString(reader.ValueSpan);
        }
        return text.Length <= 64 ? text : text[..64] + "…";
    }

    private void ParseTelemetry(ReadOnlySpan<byte> payload, ChamberRuntime chamber, DateTimeOffset receivedAt, IngestBatch batch)
    {
        var reader = new Utf8JsonReader(payload, ReaderOptions);
        if (!reader.Read())
        {
            Reject(RejectReason.MalformedJson, "empty payload");
            return;
        }
        if (reader.TokenType == JsonTokenType.StartObject)
        {
            ParseTelemetryObject(ref reader, chamber, receivedAt, batch);
        }
        else if (reader.TokenType == JsonTokenType.StartArray)
        {
            int items = 0;
            while (reader.Read() && reader.TokenType != JsonTokenType.EndArray)
            {
                items++;
                if (reader.TokenType == JsonTokenType.StartObject)
                {
                    ParseTelemetryObject(ref reader, chamber, receivedAt, batch);
                }
                else
                {
                    Reject(RejectReason.WrongType, "items of a telemetry array must be objects");
                    reader.Skip();
                }
            }
            if (items == 0)
            {
                Reject(RejectReason.Empty, "empty telemetry array");
            }
        }
        else
        {
            Reject(RejectReason.WrongType, "telemetry must be an object or an array of objects");
        }
        EnsureEnd(ref reader);
    }

    private void ParseTelemetryObject(ref Utf8JsonReader reader, ChamberRuntime chamber, DateTimeOffset receivedAt, IngestBatch batch)
    {
        long timestampUs = 0;
        long seq = SampleRow.NoSeq;
        bool haveTime = false;
        bool invalid = false;
        bool haveValues = false;
        bool haveSeq = false;
        bool sawTime = false;
        Utf8JsonReader values = default;
        while (reader.Read() && reader.TokenType != JsonTokenType.EndObject)
        {
            if (IsRepeat(ref reader, ref sawTime, "t"u8) || IsRepeat(ref reader, ref haveSeq, "seq"u8) || IsRepeatOf(ref reader, haveValues, "values"u8))
            {
                Reject(RejectReason.DuplicateKey, "property " + Printable(ref reader) + " appears twice in one telemetry object");
                invalid = true;
                reader.Read();
                reader.Skip();
            }
            else if (reader.ValueTextEquals("t"u8))
            {
                reader.Read();
                if (TryReadTimestamp(ref reader, receivedAt, out timestampUs))
                {
                    haveTime = true;
                }
                else
                {
                    invalid = true;
                }
            }
            else if (reader.ValueTextEquals("seq"u8))
            {
                invalid |= !TryReadSeq(ref reader, ref seq);
            }
            else if (reader.ValueTextEquals("values"u8))
            {
                reader.Read();
                if (reader.TokenType != JsonTokenType.StartObject)
                {
                    Reject(RejectReason.WrongType, "values must be an object of channel names to numbers");
                    invalid = true;
                }
                else
                {
                    // The time may follow the values: remember where they start and read them once the object is complete.
                    values = reader;
                }
                haveValues = true;
                reader.Skip();
            }
            else
            {
                reader.Read();
                reader.Skip();
            }
        }
        if (invalid)
        {
            return;
        }
        if (!haveTime)
        {
            Reject(RejectReason.MissingField, "telemetry object without t");
            return;
        }
        if (!haveValues)
        {
            Reject(RejectReason.MissingField, "telemetry object without values");
            return;
        }
        if (!ValuesAreUnambiguous(values, chamber))
        {
            return;
        }
        while (values.Read() && values.TokenType != JsonTokenType.EndObject)
        {
            var channel = chamber.FindChannel(ref values);
            if (channel is null)
            {
                Reject(RejectReason.UnknownChannel, "channel not configured: " + Printable(ref values));
                values.Read();
                values.Skip();
                continue;
            }
            values.Read();
            AddValue(ref values, chamber, channel, timestampUs, seq, batch);
        }
    }

    /// <summary>
    /// True when the property under <paramref name="reader"/> is <paramref name="name"/> and was seen before in this
    /// object; marks it seen otherwise.
    /// </summary>
    private static bool IsRepeat(ref Utf8JsonReader reader, ref bool seen, ReadOnlySpan<byte> name)
    {
        if (!reader.ValueTextEquals(name))
        {
            return false;
        }
        bool repeat = seen;
        seen = true;
        return repeat;
    }

    private static bool IsRepeatOf(ref Utf8JsonReader reader, bool seen, ReadOnlySpan<byte> name) => seen && reader.ValueTextEquals(name);

    /// <summary>
    /// Scans a values object once before anything is taken from it: a configured channel named twice makes the whole
    /// object ambiguous (rejected), an object without any channel is counted as empty.
    /// </summary>
    private bool ValuesAreUnambiguous(Utf8JsonReader scan, ChamberRuntime chamber)
    {
        var channels = chamber.Channels;
        Span<bool> seen = channels.Length <= 256 ? stackalloc bool[channels.Length] : new bool[channels.Length];
        int properties = 0;
        while (scan.Read() && scan.TokenType != JsonTokenType.EndObject)
        {
            properties++;
            for (int i = 0; i < channels.Length; i++)
            {
                if (scan.ValueTextEquals(channels[i].Utf8Name))
                {
                    if (seen[i])
                    {
                        Reject(RejectReason.DuplicateKey, "channel " + channels[i].Name + " appears twice in one values object");
                        return false;
                    }
                    seen[i] = true;
                    break;
                }
            }
            scan.Read();
            scan.Skip();
        }
        if (properties == 0)
        {
            Reject(RejectReason.Empty, "values without any channel");
            return false;
        }
        return true;
    }

    /// <summary>Reads the value of a "seq" property into <paramref name="seq"/>; rejects and skips it unless it is a non-negative integer.</summary>
    private bool TryReadSeq(ref Utf8JsonReader reader, ref long seq)
    {
        reader.Read();
        if (reader.TokenType == JsonTokenType.Number && reader.TryGetInt64(out long value) && value >= 0)
        {
            seq = value;
            return true;
        }
        Reject(RejectReason.WrongType, "seq must be a non-negative integer");
        reader.Skip();
        return false;
    }

    private void AddValue(ref Utf8JsonReader reader, ChamberRuntime chamber, ChannelRuntime channel, long timestampUs, long seq, IngestBatch batch)
    {
        if (reader.TokenType != JsonTokenType.Number)
        {
            Reject(RejectReason.WrongType, channel.Name + ": value must be a number, got " + reader.TokenType.ToString());
            reader.Skip();
            return;
        }
        if (!reader.TryGetDouble(out double value) || !double.IsFinite(value))
        {
            Reject(RejectReason.NotFinite, channel.Name + ": value is not a finite number");
            return;
        }
        AddChecked(value, chamber, channel, timestampUs, seq, batch);
    }

    private void AddChecked(double value, ChamberRuntime chamber, ChannelRuntime channel, long timestampUs, long seq, IngestBatch batch)
    {
        if (!double.IsFinite(value))
        {
            Reject(RejectReason.NotFinite, channel.Name + ": value is not a finite number");
            return;
        }
        if (value < channel.Min || value > channel.Max)
        {
            Reject(RejectReason.OutOfRange, channel.Name + ": " + value.ToString("R", CultureInfo.InvariantCulture) + " outside ["
                + channel.Min.ToString(CultureInfo.InvariantCulture) + ", " + channel.Max.ToString(CultureInfo.InvariantCulture) + "]");
            return;
        }
        batch.AddSample(new SampleRow(chamber.ChamberId, channel.ChannelId, timestampUs, seq, value));
    }

    private bool TryReadTimestamp(ref Utf8JsonReader reader, DateTimeOffset receivedAt, out long timestampUs)
    {
        timestampUs = 0;
        if (reader.TokenType != JsonTokenType.String)
        {
            Reject(RejectReason.WrongType, "t must be an ISO-8601 string");
            reader.Skip();
            return false;
        }
        Span<byte> scratch = stackalloc byte[64];
        scoped ReadOnlySpan<byte> text = reader.ValueSpan;
        if (reader.ValueIsEscaped)
        {
            if (reader.ValueSpan.Length > scratch.Length)
            {
                Reject(RejectReason.BadTimestamp, "t is not an ISO-8601 time");
                return false;
            }
            int copied;
            try
            {
                copied = reader.CopyString(scratch);
            }
            catch (InvalidOperationException)
            {
                // An escape that is not Unicode ("\udc00"), found by the parser fuzz test.
                Reject(RejectReason.BadTimestamp, "t is not valid Unicode text");
                return false;
            }
            text = scratch[..copied];
        }
        if (!reader.TryGetDateTimeOffset(out var timestamp) || !HasExplicitOffset(text))
        {
            Reject(RejectReason.BadTimestamp, "t is not an ISO-8601 time with offset (e.g. 2026-03-04T10:00:00.125Z)");
            return false;
        }
        return CheckTime(timestamp, receivedAt, out timestampUs);
    }

    private bool CheckTime(DateTimeOffset timestamp, DateTimeOffset receivedAt, out long timestampUs)
    {
        timestampUs = UnixMicros.From(timestamp);
        if (timestamp - receivedAt > _options.MaxFutureSkew)
        {
            Reject(RejectReason.TimestampInFuture, "t is " + (timestamp - receivedAt).TotalSeconds.ToString("F0", CultureInfo.InvariantCulture) + " s ahead of the daemon's clock");
            return false;
        }
        if (receivedAt - timestamp > _options.MaxSampleAge)
        {
            Reject(RejectReason.TimestampTooOld, "t is older than Ingest:MaxSampleAge");
            return false;
        }
        return true;
    }

    /// <summary>True when an ISO-8601 time ends in Z or a ±hh:mm offset after its time part.</summary>
    internal static bool HasExplicitOffset(ReadOnlySpan<byte> text)
    {
        if (text.IsEmpty)
        {
            return false;
        }
        byte last = text[^1];
        if (last is (byte)'Z' or (byte)'z')
        {
            return true;
        }
        int timeStart = text.IndexOfAny((byte)'T', (byte)'t');
        return timeStart >= 0 && text[(timeStart + 1)..].IndexOfAny((byte)'+', (byte)'-') >= 0;
    }

    private static void EnsureEnd(ref Utf8JsonReader reader)
    {
        // Throws JsonException on anything but whitespace after the root value.
        if (reader.Read())
        {
            throw new JsonException("data after the end of the JSON value");
        }
    }
}
