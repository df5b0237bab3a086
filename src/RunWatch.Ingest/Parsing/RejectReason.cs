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
}
