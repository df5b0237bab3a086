namespace RunWatch.Ingest.Runs;

/// <summary>Told by the run tracker when a chamber's run begins and ends (the alert engine's stale and flatline checks need it).</summary>
internal interface IRunLifecycleListener
{
    void RunStarted(long chamberId, long timestampUs, double? setpointC);

    void RunEnded(long chamberId, long timestampUs);
}
