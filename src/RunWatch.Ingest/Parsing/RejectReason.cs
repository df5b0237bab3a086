namespace RunWatch.Ingest.Parsing;

/// <summary>Why an input (a message, an object of a batch, or one value) was not stored. Codes are stable (metrics, dead letters).</summary>
internal enum RejectReason
{
    MalformedJson = 0,
    WrongType,
    NotFinite,
    OutOfRange,
    UnknownChamber,
    UnknownChannel,
    UnknownTopic,
    MissingField,
    BadTimestamp,
    TimestampInFuture,
    TimestampTooOld,
    Oversize,
    UnknownEventType,
    ParserFault,
    Duplicate,

    /// <summary>The payload is not valid UTF-8; values that can still be read are kept.</summary>
    MalformedUtf8,

    /// <summary>A property (t, seq, values, v, a channel, an event field) appears twice: which one counts is ambiguous.</summary>
    DuplicateKey,

    /// <summary>Well-formed but nothing to store: <c>[]</c>, <c>{"t":…,"values":{}}</c>.</summary>
    Empty,

    /// <summary>Counted, not rejected: a run-start without a run id (the run is kept under an automatic name).</summary>
    RunStartWithoutId,
}
