using RunWatch.Storage;

namespace RunWatch.Ingest.Alerts;

/// <summary>What the sinks receive: the alert after a change, and which change it was.</summary>
/// <param name="Alert">The alert record.</param>
/// <param name="Change">raised, acknowledged, cleared, normal, shelved or unshelved.</param>
/// <param name="Site">Site of the chamber (topic), null for daemon-wide.</param>
internal sealed record AlertNotification(AlertRecord Alert, string Change, string? Site);
