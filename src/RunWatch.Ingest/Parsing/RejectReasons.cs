namespace RunWatch.Ingest.Parsing;

/// <summary>Stable codes of <see cref="RejectReason"/>.</summary>
internal static class RejectReasons
{
    public const int Count = (int)RejectReason.Duplicate + 1;

    private static readonly string[] Codes =
    [
        "malformed_json", "wrong_type", "not_finite", "out_of_range", "unknown_chamber", "unknown_channel", "unknown_topic",
        "missing_field", "bad_timestamp", "timestamp_future", "timestamp_too_old", "oversize", "unknown_event_type", "parser_fault", "duplicate",
    ];

    public static string Code(RejectReason reason) => Codes[(int)reason];

    public static IReadOnlyList<string> AllCodes => Codes;
}
