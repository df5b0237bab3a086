namespace RunWatch.Ingest.Pipeline;

/// <summary>Daemon-wide conditions that become alerts (raised once, cleared when they end).</summary>
internal interface IDaemonConditions
{
    /// <summary>The store cannot be written; nothing is being acknowledged.</summary>
    void StoreUnavailable(string error);

    /// <summary>The store accepts writes again.</summary>
    void StoreRecovered();
}
