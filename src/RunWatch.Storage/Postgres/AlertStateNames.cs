namespace RunWatch.Storage.Postgres;

/// <summary>Alert states as stored (the same words as the SQLite store).</summary>
internal static class AlertStateNames
{
    public static string Name(AlertState state) => state switch
    {
        AlertState.Normal => "normal",
        AlertState.Unacknowledged => "unacknowledged",
        AlertState.Acknowledged => "acknowledged",
        AlertState.ReturnedUnacknowledged => "returned-unacknowledged",
        AlertState.Shelved => "shelved",
        AlertState.Suppressed => "suppressed",
        _ => throw new ArgumentOutOfRangeException(nameof(state), state, null),
    };

    public static AlertState Parse(string name) => name switch
    {
        "normal" => AlertState.Normal,
        "unacknowledged" => AlertState.Unacknowledged,
        "acknowledged" => AlertState.Acknowledged,
        "returned-unacknowledged" => AlertState.ReturnedUnacknowledged,
        "shelved" => AlertState.Shelved,
        "suppressed" => AlertState.Suppressed,
        _ => throw new InvalidDataException("Unknown alert state in store: " + name),
    };
}
