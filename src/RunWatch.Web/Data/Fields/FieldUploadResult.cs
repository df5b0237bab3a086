namespace RunWatch.Web.Data.Fields;

/// <summary>What became of an upload: stored (with the field's id, wafer and state) or refused with the reason, nothing stored.</summary>
public sealed record FieldUploadResult(bool Stored, string? FieldId, string? WaferId, FieldQueueState? State, string Message)
{
    public static FieldUploadResult Refused(string message) => new(false, null, null, null, message);
}
