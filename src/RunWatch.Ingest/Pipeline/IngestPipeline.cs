using System.Diagnostics;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using RunWatch.Ingest.Chambers;
using RunWatch.Ingest.Configuration;
using RunWatch.Ingest.Health;
using RunWatch.Ingest.Parsing;
using RunWatch.Storage;

namespace RunWatch.Ingest.Pipeline;

/// <summary>
/// The single committer: takes messages from the queue in batches bounded by count and time, parses them, writes the
/// batch in one transaction, and only then acknowledges the messages to the broker. While the store fails, it keeps
/// the batch, acknowledges nothing, raises the store alert and retries with backoff; the full queue then holds the
/// MQTT client back, so the broker keeps the rest.
/// </summary>
internal sealed class IngestPipeline
{
    private readonly InboundQueue _queue;
    private readonly IRunWatchStore _store;
    private readonly ChamberRegistryHolder _registry;
    private readonly AcknowledgementStage _acknowledgements;
    private readonly IReadOnlyList<ICommittedBatchObserver> _observers;
    private readonly IReadOnlyList<IDaemonConditions> _conditions;
    private readonly IngestMetrics _metrics;
    private readonly IngestHealth _health;
    private readonly IngestOptions _options;
    private readonly int _deadLetterPayloadBytes;
    private readonly TimeProvider _timeProvider;
    private readonly ILogger _logger;
    private readonly RejectLogLimiter _rejectLog;
    private readonly List<InboundMessage> _messages;
    private readonly IngestBatch _batch = new(4096);
    private readonly List<ChamberEvent> _events = [];
    private readonly RejectTally _tally = new();
    private long _lastParserFaultLog;
    private MessageParser? _parser;

    public IngestPipeline(
        InboundQueue queue,
        IRunWatchStore store,
        ChamberRegistryHolder registry,
        IMessageAcknowledger acknowledger,
        IEnumerable<ICommittedBatchObserver> observers,
        IEnumerable<IDaemonConditions> conditions,
        IngestMetrics metrics,
        IngestHealth health,
        IOptions<IngestOptions> options,
        IOptions<StorageOptions> storageOptions,
        TimeProvider timeProvider,
        ILogger<IngestPipeline> logger)
    {
        _queue = queue;
        _store = store;
        _registry = registry;
        _acknowledgements = new AcknowledgementStage(acknowledger, metrics);
        _observers = [.. observers];
        _conditions = [.. conditions];
        _metrics = metrics;
        _health = health;
        _options = options.Value;
        _deadLetterPayloadBytes = storageOptions.Value.DeadLetterPayloadBytes;
        _timeProvider = timeProvider;
        _logger = logger;
        _rejectLog = new RejectLogLimiter(logger, timeProvider, _options.RejectLogInterval);
        _messages = new List<InboundMessage>(_options.MaxBatchMessages);
        health.QueueDepth = () => queue.Count;
    }

    /// <summary>Runs until cancelled, then commits what is already queued and returns.</summary>
    public async Task RunAsync(CancellationToken stoppingToken)
    {
        var acknowledging = _acknowledgements.RunAsync();
        try
        {
            await CommitLoopAsync(stoppingToken).ConfigureAwait(false);
        }
        finally
        {
            // Everything committed is acknowledged before the connection is allowed to close.
            _acknowledgements.Complete();
            await acknowledging.ConfigureAwait(false);
        }
    }

    private async Task CommitLoopAsync(CancellationToken stoppingToken)
    {
        var reader = _queue.Reader;
        while (!stoppingToken.IsCancellationRequested)
        {
            try
            {
                if (!await reader.WaitToReadAsync(stoppingToken).ConfigureAwait(false))
                {
                    return;
                }
                await CollectAsync(stoppingToken).ConfigureAwait(false);
            }
            catch (OperationCanceledException) when (stoppingToken.IsCancellationRequested)
            {
                break;
            }
            await ProcessAsync(stoppingToken).ConfigureAwait(false);
        }
        await DrainAsync().ConfigureAwait(false);
    }

    /// <summary>Fills the batch: up to MaxBatchMessages, no longer than MaxBatchDelay after the first, lingering briefly when the queue runs dry.</summary>
    private async Task CollectAsync(CancellationToken cancellationToken)
    {
        var reader = _queue.Reader;
        long first = -1;
        while (_messages.Count < _options.MaxBatchMessages)
        {
            if (reader.TryRead(out var message))
            {
                if (first < 0)
                {
                    first = message.ReceivedTimestamp;
                }
                _messages.Add(message);
                continue;
            }
            var remaining = _options.MaxBatchDelay - _timeProvider.GetElapsedTime(first < 0 ? _timeProvider.GetTimestamp() : first);
            var wait = remaining < _options.BatchLinger ? remaining : _options.BatchLinger;
            if (wait <= TimeSpan.Zero)
            {
                return;
            }
            var waitTask = reader.WaitToReadAsync(cancellationToken).AsTask();
            var delay = Task.Delay(wait, _timeProvider, cancellationToken);
            if (await Task.WhenAny(waitTask, delay).ConfigureAwait(false) != waitTask || !await waitTask.ConfigureAwait(false))
            {
                return;
            }
        }
    }

    private async Task ProcessAsync(CancellationToken stoppingToken)
    {
        if (_messages.Count == 0)
        {
            return;
        }
        try
        {
            Parse();
            await CommitAsync(stoppingToken).ConfigureAwait(false);
        }
        finally
        {
            foreach (var message in _messages)
            {
                InboundQueue.Release(message);
            }
            _messages.Clear();
            _batch.Clear();
            _events.Clear();
            _tally.Clear();
        }
    }

    private void Parse()
    {
        var parser = _parser ??= new MessageParser(_registry.Registry, _options, _deadLetterPayloadBytes);
        foreach (var message in _messages)
        {
            int samplesBefore = _batch.SampleCount;
            try
            {
                parser.Parse(message.Topic, message.Payload, message.PayloadLength, message.ReceivedAt, _batch, _events, _tally);
            }
            catch (Exception ex) when (ex is not OutOfMemoryException)
            {
                // A parser bug must not take the daemon down: drop what this message added and keep it as a dead letter.
                _batch.TruncateSamples(samplesBefore);
                _tally.Add(RejectReason.ParserFault, ex.GetType().Name);
                _batch.DeadLetters.Add(new DeadLetter(message.ReceivedAt, message.Topic, RejectReasons.Code(RejectReason.ParserFault), ex.Message,
                    message.Payload[..Math.Min(message.Length, _deadLetterPayloadBytes)].ToArray(), message.PayloadLength));
                // One stack trace per interval at most: a flood of one bad input must not fill the disk with logs.
                long now = _timeProvider.GetTimestamp();
                if (_lastParserFaultLog == 0 || _timeProvider.GetElapsedTime(_lastParserFaultLog, now) >= _options.RejectLogInterval)
                {
                    _lastParserFaultLog = now;
                    Log.ParserFault(_logger, message.Topic, ex);
                }
            }
        }
    }

    private async Task CommitAsync(CancellationToken stoppingToken)
    {
        var delay = _options.CommitRetryInitialDelay;
        bool failed = false;
        BatchWriteResult result;
        long started;
        while (true)
        {
            started = Stopwatch.GetTimestamp();
            try
            {
                result = await _store.WriteBatchAsync(_batch, CancellationToken.None).ConfigureAwait(false);
                break;
            }
            catch (Exception ex) when (ex is not OperationCanceledException and not OutOfMemoryException)
            {
                var error = ex as StoreUnavailableException ?? new StoreUnavailableException(ex.Message, ex);
                _metrics.CommitFailures.Inc();
                _health.CommitFailed(error);
                if (!failed)
                {
                    Log.CommitFailed(_logger, _messages.Count, error.Message);
                    foreach (var conditions in _conditions)
                    {
                        conditions.StoreUnavailable(error.Message);
                    }
                    failed = true;
                }
                try
                {
                    await Task.Delay(delay, _timeProvider, stoppingToken).ConfigureAwait(false);
                }
                catch (OperationCanceledException)
                {
                    // Shutting down with the store still failing: nothing is acknowledged, the broker keeps it all.
                    Log.GaveUpOnShutdown(_logger, _messages.Count);
                    return;
                }
                delay = TimeSpan.FromTicks(Math.Min(delay.Ticks * 2, _options.CommitRetryMaxDelay.Ticks));
            }
        }
        var now = _timeProvider.GetUtcNow();
        _metrics.CommitSeconds.Observe(Stopwatch.GetElapsedTime(started).TotalSeconds);
        if (failed)
        {
            Log.CommitRecovered(_logger);
            foreach (var conditions in _conditions)
            {
                conditions.StoreRecovered();
            }
        }

        // Committed: from here on the PUBACKs may go out, on the acknowledgement stage's own loop.
        await _acknowledgements.SubmitAsync(_messages).ConfigureAwait(false);

        if (result.SampleDuplicates > 0)
        {
            _tally.Add(RejectReason.Duplicate, "already stored (redelivery)", result.SampleDuplicates);
        }
        Account(result, now);
        foreach (var observer in _observers)
        {
            try
            {
                observer.OnCommitted(_batch, _events, now);
            }
            catch (Exception ex) when (ex is not OutOfMemoryException)
            {
                Log.ObserverFailed(_logger, observer.GetType().Name, ex);
            }
        }
    }

    private void Account(BatchWriteResult result, DateTimeOffset now)
    {
        _metrics.Messages.Inc(_messages.Count);
        _metrics.Samples.Inc(result.SamplesInserted);
        _metrics.BatchMessages.Observe(_messages.Count);
        _metrics.AddRejects(_tally);
        if (_tally.Total > 0)
        {
            _rejectLog.Report(_tally, _batch.DeadLetters.Count > 0 ? _batch.DeadLetters[0].Topic : _messages[0].Topic);
        }

        long nowUs = UnixMicros.From(now);
        long newestUs = long.MinValue;
        long outOfOrder = 0;
        var registry = _registry.Registry;
        var samples = _batch.Samples;
        var inserted = _batch.Inserted;
        ChamberRuntime? chamber = null;
        for (int i = 0; i < samples.Length; i++)
        {
            if (!inserted[i])
            {
                continue;
            }
            ref readonly var sample = ref samples[i];
            if (chamber is null || chamber.ChamberId != sample.ChamberId)
            {
                chamber = registry.Find(sample.ChamberId);
            }
            var channel = chamber?.FindChannel(sample.ChannelId);
            if (channel is not null)
            {
                if (sample.TimestampUs < channel.LastTimestampUs)
                {
                    outOfOrder++;
                }
                else
                {
                    channel.LastTimestampUs = sample.TimestampUs;
                }
            }
            newestUs = Math.Max(newestUs, sample.TimestampUs);
            _metrics.SampleLagSeconds.Observe(Math.Max(0, nowUs - sample.TimestampUs) / 1e6);
        }
        if (outOfOrder > 0)
        {
            _metrics.OutOfOrder.Inc(outOfOrder);
        }
        double batchLatencyMs = _timeProvider.GetElapsedTime(_messages[0].ReceivedTimestamp).TotalMilliseconds;
        double sampleLagMs = newestUs == long.MinValue ? 0 : (nowUs - newestUs) / 1000.0;
        _health.CommitSucceeded(now, _messages.Count, batchLatencyMs, sampleLagMs);
        _metrics.QueueDepth.Set(_queue.Count);
    }

    private async Task DrainAsync()
    {
        // Commit what is already queued so that it can still be acknowledged before the connection closes.
        using var deadline = new CancellationTokenSource(TimeSpan.FromSeconds(5), _timeProvider);
        while (!deadline.IsCancellationRequested && _queue.Reader.TryRead(out var message))
        {
            _messages.Add(message);
            while (_messages.Count < _options.MaxBatchMessages && _queue.Reader.TryRead(out message))
            {
                _messages.Add(message);
            }
            await ProcessAsync(deadline.Token).ConfigureAwait(false);
        }
    }
}
