using RunWatch.Ingest.Alerts;
using RunWatch.Ingest.Pipeline;
using RunWatch.Storage;
using RunWatch.Web.Data;
using RunWatch.Web.Live;

namespace RunWatch.Hosting;

/// <summary>Pushes what ingest commits and what the alert engine changes to open dashboard pages.</summary>
internal sealed class DashboardLiveBridge(ITelemetryNotifier notifier) : IIngestCommitListener, IAlertListener
{
    public void Committed(IReadOnlyList<CommittedSample> samples, IReadOnlyCollection<string> chambersWithEvents)
    {
        if (samples.Count > 0)
        {
            var live = new LiveSample[samples.Count];
            for (int i = 0; i < live.Length; i++)
            {
                CommittedSample s = samples[i];
                live[i] = new LiveSample(s.Chamber, s.Channel, s.Time, s.Value);
            }
            notifier.SamplesCommitted(live);
        }
        foreach (string chamber in chambersWithEvents)
        {
            notifier.RunsChanged(chamber);
        }
    }

    public void AlertChanged(AlertRecord alert, string change) => notifier.AlertsChanged(alert.Chamber ?? "");
}
