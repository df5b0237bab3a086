namespace RunWatch.Ingest.Parsing;

/// <summary>Stable codes of <see cref="RejectReason"/>.</summary>
internal static class RejectReasons
{
    public const int Count = (int)RejectReason.RunStartWithoutId + 1;

    private static readonly string[] Codes =
    [
        "malformed_json", "wrong_type", "not_finite", "out_of_range", "unknown_chamber", "unknown_channel", "unknown_topic",
        "missing_field", "bad_timestamp", "timestamp_future", "timestamp_too_old", "oversize", "unknown_event_type", "parser_fault", "duplicate",
        "malformed_utf8", "duplicate_key", "empty", "run_start_without_id",
    ];

    public static string Code(RejectReason reason) => Codes[(int)reason];

    /// <summary>True for a count that loses nothing (the input was kept), so it makes no dead letter.</summary>
    public static bool IsNotice(RejectReason reason) => reason == RejectReason.RunStartWithoutId;

    public static IReadOnlyList<string> AllCodes => Codes;
}
