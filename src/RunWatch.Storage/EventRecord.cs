namespace RunWatch.Storage;

/// <summary>A chamber event (run-start, run-end, step, note). Identity is (chamber, timestamp, type).</summary>
/// <param name="ChamberId">Store id of the chamber.</param>
/// <param name="Timestamp">Event time (UTC).</param>
/// <param name="Type">Event type as published: <c>run-start</c>, <c>run-end</c>, <c>step</c> or <c>note</c>.</param>
/// <param name="RunName">Run name the event names, if any.</param>
/// <param name="Text">Step name or note text, if any.</param>
/// <param name="PayloadJson">The event's JSON as received.</param>
public sealed record EventRecord(long ChamberId, DateTimeOffset Timestamp, string Type, string? RunName, string? Text, string PayloadJson);
