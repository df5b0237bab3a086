using RunWatch.Web.Data;

namespace RunWatch.Web.Live;

/// <summary>
/// Called by the ingest after each commit so that open pages update without polling. Calls must be cheap and
/// never throw: the notifier only hands the news to subscribed circuits.
/// </summary>
public interface ITelemetryNotifier
{
    /// <summary>Samples were committed to the store.</summary>
    void SamplesCommitted(IReadOnlyList<LiveSample> samples);

    /// <summary>An alert was raised, acknowledged, shelved or cleared.</summary>
    void AlertsChanged(string chamber);

    /// <summary>A run started or ended, or a wafer's result changed.</summary>
    void RunsChanged(string chamber);
}
