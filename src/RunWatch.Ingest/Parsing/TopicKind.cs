namespace RunWatch.Ingest.Parsing;

/// <summary>Kinds of inbound topics of the message contract.</summary>
internal enum TopicKind
{
    Unknown = 0,

    /// <summary><c>{root}/{site}/{chamber}/telemetry</c>: an object or an array of objects.</summary>
    Telemetry,

    /// <summary><c>{root}/{site}/{chamber}/ch/{channel}</c>: a bare number or <c>{"t","v"}</c>.</summary>
    Channel,

    /// <summary><c>{root}/{site}/{chamber}/event</c>.</summary>
    Event,
}
