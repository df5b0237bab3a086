namespace RunWatch.Web.Data.Fields;

/// <summary>One field in the queue list: id, file, wafer, state, reason, when it arrived, wires found.</summary>
public sealed record FieldQueueEntry(string FieldId, string FileName, string? WaferId, FieldQueueState State, string? Reason, DateTimeOffset ImportedAt, int? WireCount);
