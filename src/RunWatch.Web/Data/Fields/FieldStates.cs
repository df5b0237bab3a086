using RunWatch.Storage;

namespace RunWatch.Web.Data.Fields;

/// <summary>The queue state the screens show for a stored field.</summary>
public static class FieldStates
{
    public static FieldQueueState Of(FieldRecord field, bool running)
    {
        ArgumentNullException.ThrowIfNull(field);
        return field.Status switch
        {
            FieldStatus.Queued => running ? FieldQueueState.Running : FieldQueueState.Queued,
            FieldStatus.Analysed => FieldQueueState.Done,
            FieldStatus.Failed => FieldQueueState.Failed,
            _ => field.Problem is { } p && p.StartsWith(RefusedPrefix, StringComparison.Ordinal) ? FieldQueueState.Refused : FieldQueueState.WaitingForWafer,
        };
    }

    /// <summary>The wafer room's prefix of a refusal at intake (FieldIntake.RefusedPrefix).</summary>
    public const string RefusedPrefix = "refused: ";

    /// <summary>The word shown for a state.</summary>
    public static string Label(FieldQueueState state) => state switch
    {
        FieldQueueState.Queued => "QUEUED",
        FieldQueueState.Running => "RUNNING",
        FieldQueueState.Done => "DONE",
        FieldQueueState.Failed => "FAILED",
        FieldQueueState.Refused => "REFUSED",
        _ => "WAITING FOR WAFER",
    };

    /// <summary>The state label's kind (shape and colour, as the other states on the dashboard).</summary>
    public static string Kind(FieldQueueState state) => state switch
    {
        FieldQueueState.Done => "normal",
        FieldQueueState.Queued or FieldQueueState.Running => "idle",
        FieldQueueState.WaitingForWafer => "warning",
        _ => "alarm",
    };
}
