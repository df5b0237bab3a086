using Prometheus;
using RunWatch.Ingest.Parsing;

namespace RunWatch.Ingest.Pipeline;

/// <summary>Prometheus series of the daemon. Children per reject reason are created once, so counting allocates nothing.</summary>
internal sealed class IngestMetrics
{
    private readonly Counter.Child[] _rejects;

    public IngestMetrics(CollectorRegistry registry)
    {
        var factory = Metrics.WithCustomRegistry(registry);
        Messages = factory.CreateCounter("runwatch_ingest_messages_total", "MQTT messages taken from the ingest queue.");
        Samples = factory.CreateCounter("runwatch_ingest_samples_total", "Telemetry samples newly stored.");
        var rejects = factory.CreateCounter("runwatch_ingest_rejects_total", "Inputs not stored, by reason (duplicate = already stored).", "reason");
        _rejects = new Counter.Child[RejectReasons.Count];
        for (int i = 0; i < _rejects.Length; i++)
        {
            _rejects[i] = rejects.WithLabels(RejectReasons.Code((RejectReason)i));
        }
        OutOfOrder = factory.CreateCounter("runwatch_ingest_out_of_order_total", "Samples stored whose time is before the channel's newest stored sample.");
        AckFailures = factory.CreateCounter("runwatch_ingest_ack_failures_total", "Acknowledgements that could not be sent (the broker redelivers; inserts are idempotent).");
        CommitFailures = factory.CreateCounter("runwatch_store_commit_failures_total", "Batch commits that failed (nothing of them acknowledged).");
        CommitSeconds = factory.CreateHistogram("runwatch_ingest_batch_commit_seconds", "Time to write one batch in one transaction.",
            new HistogramConfiguration { Buckets = Histogram.ExponentialBuckets(0.0005, 2, 14) });
        SampleLagSeconds = factory.CreateHistogram("runwatch_ingest_commit_lag_seconds", "Commit time minus the sample's own time (publisher clock), per stored sample.",
            new HistogramConfiguration { Buckets = Histogram.ExponentialBuckets(0.001, 1.25, 40) });
        AckSeconds = factory.CreateHistogram("runwatch_ingest_batch_ack_seconds", "Time to send the acknowledgements of one committed batch.",
            new HistogramConfiguration { Buckets = Histogram.ExponentialBuckets(0.0005, 2, 14) });
        BatchMessages = factory.CreateHistogram("runwatch_ingest_batch_messages", "Messages per committed batch.",
            new HistogramConfiguration { Buckets = Histogram.ExponentialBuckets(1, 2, 12) });
        QueueDepth = factory.CreateGauge("runwatch_ingest_queue_depth", "Messages waiting for the committer.");
        BrokerConnected = factory.CreateGauge("runwatch_broker_connected", "1 while connected to the broker.");
        AlertsActive = factory.CreateGauge("runwatch_alerts_active", "Alerts not back to normal.");
        RunsOpen = factory.CreateGauge("runwatch_runs_open", "Runs open.");
    }

    public Counter Messages { get; }

    public Counter Samples { get; }

    public Counter OutOfOrder { get; }

    public Counter AckFailures { get; }

    public Counter CommitFailures { get; }

    public Histogram CommitSeconds { get; }

    public Histogram SampleLagSeconds { get; }

    public Histogram AckSeconds { get; }

    public Histogram BatchMessages { get; }

    public Gauge QueueDepth { get; }

    public Gauge BrokerConnected { get; }

    public Gauge AlertsActive { get; }

    public Gauge RunsOpen { get; }

    public void AddRejects(RejectTally tally)
    {
        for (int i = 0; i < _rejects.Length; i++)
        {
            long count = tally[(RejectReason)i];
            if (count > 0)
            {
                _rejects[i].Inc(count);
            }
        }
    }

    public double RejectCount(RejectReason reason) => _rejects[(int)reason].Value;
}
