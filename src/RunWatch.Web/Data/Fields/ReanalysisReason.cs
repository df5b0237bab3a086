namespace RunWatch.Web.Data.Fields;

/// <summary>The reason an engineer gives for a re-analysis: required, one line, bounded.</summary>
public static class ReanalysisReason
{
    /// <summary>Longest reason kept, characters.</summary>
    public const int MaxLength = 300;

    /// <summary>Why the reason is not acceptable, or null.</summary>
    public static string? Problem(string? reason) =>
        string.IsNullOrWhiteSpace(reason) ? "Say why the field should be analysed again (for example: new threshold settings, model accepted)."
        : reason.Length > MaxLength ? $"The reason has {reason.Length} characters; at most {MaxLength}."
        : null;
}
