namespace RunWatch.Ingest.Chambers;

/// <summary>A parsed event, handed to the run tracker after its batch is committed.</summary>
/// <param name="ChamberId">Store id of the chamber.</param>
/// <param name="Timestamp">Event time.</param>
/// <param name="Type">run-start, run-end, step or note.</param>
/// <param name="RunName">Run named by the event.</param>
/// <param name="Wafers">Wafers (run-start).</param>
/// <param name="Recipe">Recipe (run-start).</param>
/// <param name="SetpointC">Growth setpoint, °C (run-start).</param>
/// <param name="PlannedSeconds">Planned growth time, s (run-start).</param>
/// <param name="Text">Step name or note text.</param>
internal sealed record ChamberEvent(
    long ChamberId,
    DateTimeOffset Timestamp,
    string Type,
    string? RunName,
    IReadOnlyList<string> Wafers,
    string? Recipe,
    double? SetpointC,
    double? PlannedSeconds,
    string? Text);
