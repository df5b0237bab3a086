namespace RunWatch.Storage;

/// <summary>A stored dead letter as read back.</summary>
/// <param name="Id">Row id (increasing).</param>
/// <param name="Letter">The dead letter.</param>
public sealed record DeadLetterRecord(long Id, DeadLetter Letter);
