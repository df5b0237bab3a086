using RunWatch.Storage;

namespace RunWatch.Wafers.Pipeline;

/// <summary>What became of one upload: the HTTP status it stands for, the reason when refused, the field when stored.</summary>
/// <param name="StatusCode">201 stored as new, 200 the same image was stored before, 400/409/413 refused.</param>
/// <param name="Problem">Why it was refused (nothing was stored); null when stored.</param>
/// <param name="Field">The stored field (queued, or unassigned with its reason); null when refused.</param>
/// <param name="Added">Whether the field is new (false when the same bytes were taken in before).</param>
public sealed record FieldUploadOutcome(int StatusCode, string? Problem, FieldRecord? Field, bool Added)
{
    internal static FieldUploadOutcome Refused(int statusCode, string problem) => new(statusCode, problem, null, false);
}
