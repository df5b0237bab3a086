using System.Text;
using System.Text.Json;
using RunWatch.Ingest.Chambers;
using RunWatch.Storage;

namespace RunWatch.Ingest.Parsing;

/// <summary>Events: <c>{"t":…,"type":"run-start","run":"R0412","wafers":[…],"recipe":…,"setpoint_c":610,"planned_s":1800}</c>.</summary>
internal sealed partial class MessageParser
{
    private void ParseEvent(ReadOnlySpan<byte> payload, ChamberRuntime chamber, DateTimeOffset receivedAt, IngestBatch batch, List<ChamberEvent> events)
    {
        // Events are rare; a DOM is simpler here than a streaming read and costs nothing that matters.
        using var document = JsonDocument.Parse(payload.ToArray(), new JsonDocumentOptions { MaxDepth = 16 });
        var root = document.RootElement;
        if (root.ValueKind != JsonValueKind.Object)
        {
            Reject(RejectReason.WrongType, "an event must be a JSON object");
            return;
        }
        try
        {
            ParseEventObject(root, payload, chamber, receivedAt, batch, events);
        }
        catch (InvalidOperationException)
        {
            // GetString on an escaped lone surrogate ("\udc00"): the text is not Unicode.
            Reject(RejectReason.MalformedUtf8, "an event string is not valid Unicode");
        }
    }

    private void ParseEventObject(JsonElement root, ReadOnlySpan<byte> payload, ChamberRuntime chamber, DateTimeOffset receivedAt, IngestBatch batch, List<ChamberEvent> events)
    {
        var names = new HashSet<string>(StringComparer.Ordinal);
        foreach (var property in root.EnumerateObject())
        {
            if (!names.Add(property.Name))
            {
                Reject(RejectReason.DuplicateKey, "event property " + (property.Name.Length <= 64 ? property.Name : property.Name[..64]) + " appears twice");
                return;
            }
        }
        if (!root.TryGetProperty("t", out var t) || !root.TryGetProperty("type", out var typeElement))
        {
            Reject(RejectReason.MissingField, "an event needs t and type");
            return;
        }
        if (t.ValueKind != JsonValueKind.String || typeElement.ValueKind != JsonValueKind.String)
        {
            Reject(RejectReason.WrongType, "t and type must be strings");
            return;
        }
        if (!t.TryGetDateTimeOffset(out var timestamp) || !HasExplicitOffset(Encoding.UTF8.GetBytes(t.GetString()!)))
        {
            Reject(RejectReason.BadTimestamp, "t is not an ISO-8601 time with offset");
            return;
        }
        if (!CheckTime(timestamp, receivedAt, out _))
        {
            return;
        }
        string type = typeElement.GetString()!;
        if (type is not ("run-start" or "run-end" or "step" or "note"))
        {
            Reject(RejectReason.UnknownEventType, "event type must be run-start, run-end, step or note; got " + type);
            return;
        }
        if (!TryGetString(root, "run", out string? run) || !TryGetString(root, "recipe", out string? recipe)
            || !TryGetString(root, "text", out string? text) || !TryGetString(root, "step", out string? step)
            || !TryGetNumber(root, "setpoint_c", out double? setpoint) || !TryGetNumber(root, "planned_s", out double? planned)
            || !TryGetStrings(root, "wafers", out var wafers))
        {
            return;
        }
        if (planned is < 0)
        {
            Reject(RejectReason.OutOfRange, "planned_s must not be negative");
            return;
        }
        if (type == "run-start" && string.IsNullOrWhiteSpace(run))
        {
            Reject(RejectReason.RunStartWithoutId, "run-start without run id; kept under an automatic name");
        }
        string? eventText = type == "step" ? step ?? text : text;
        var parsed = new ChamberEvent(chamber.ChamberId, timestamp, type, run, wafers, recipe, setpoint, planned, eventText);
        events.Add(parsed);
        batch.Events.Add(new EventRecord(chamber.ChamberId, timestamp, type, run, eventText, Encoding.UTF8.GetString(payload)));
    }

    private bool TryGetString(JsonElement root, string name, out string? value)
    {
        value = null;
        if (!root.TryGetProperty(name, out var element) || element.ValueKind == JsonValueKind.Null)
        {
            return true;
        }
        if (element.ValueKind != JsonValueKind.String)
        {
            Reject(RejectReason.WrongType, name + " must be a string");
            return false;
        }
        value = element.GetString();
        return true;
    }

    private bool TryGetNumber(JsonElement root, string name, out double? value)
    {
        value = null;
        if (!root.TryGetProperty(name, out var element) || element.ValueKind == JsonValueKind.Null)
        {
            return true;
        }
        if (element.ValueKind != JsonValueKind.Number)
        {
            Reject(RejectReason.WrongType, name + " must be a number");
            return false;
        }
        if (!element.TryGetDouble(out double number) || !double.IsFinite(number))
        {
            Reject(RejectReason.NotFinite, name + " is not a finite number");
            return false;
        }
        value = number;
        return true;
    }

    private bool TryGetStrings(JsonElement root, string name, out IReadOnlyList<string> values)
    {
        values = [];
        if (!root.TryGetProperty(name, out var element) || element.ValueKind == JsonValueKind.Null)
        {
            return true;
        }
        if (element.ValueKind != JsonValueKind.Array)
        {
            Reject(RejectReason.WrongType, name + " must be an array of strings");
            return false;
        }
        var list = new List<string>();
        foreach (var item in element.EnumerateArray())
        {
            if (item.ValueKind != JsonValueKind.String)
            {
                Reject(RejectReason.WrongType, name + " must be an array of strings");
                return false;
            }
            list.Add(item.GetString()!);
        }
        values = list;
        return true;
    }
}
