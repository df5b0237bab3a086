using Microsoft.Extensions.Logging;

namespace RunWatch.Ingest;

/// <summary>
/// Log messages of ingest (event ids: 2000 pipeline, 2100 broker connection, 2200 embedded broker, 2300 runs,
/// 2400 alerts, 2500 retention). Payloads and credentials are never part of these templates.
/// </summary>
internal static partial class Log
{
    [LoggerMessage(EventId = 2000, Level = LogLevel.Information, Message = "Registered {ChamberCount} chamber(s) in the store")]
    public static partial void ChambersRegistered(ILogger logger, int chamberCount);

    [LoggerMessage(EventId = 2001, Level = LogLevel.Warning, Message = "Rejected {Count} input(s) for {Reason}: {Detail} (topic {Topic}); further rejects for this reason are counted, not logged, for a while")]
    public static partial void InputRejected(ILogger logger, long count, string reason, string detail, string topic);

    [LoggerMessage(EventId = 2002, Level = LogLevel.Error, Message = "Store write failed for a batch of {MessageCount} message(s): {Error}; nothing acknowledged, retrying with backoff")]
    public static partial void CommitFailed(ILogger logger, int messageCount, string error);

    [LoggerMessage(EventId = 2003, Level = LogLevel.Information, Message = "Store writable again; ingest resumed")]
    public static partial void CommitRecovered(ILogger logger);

    [LoggerMessage(EventId = 2004, Level = LogLevel.Warning, Message = "Shutting down with {MessageCount} uncommitted message(s); they stay unacknowledged and the broker will redeliver them")]
    public static partial void GaveUpOnShutdown(ILogger logger, int messageCount);

    [LoggerMessage(EventId = 2005, Level = LogLevel.Error, Message = "Parser fault on a message of topic {Topic}; kept as a dead letter")]
    public static partial void ParserFault(ILogger logger, string topic, Exception exception);

    [LoggerMessage(EventId = 2006, Level = LogLevel.Error, Message = "Post-commit observer {Observer} failed")]
    public static partial void ObserverFailed(ILogger logger, string observer, Exception exception);

    [LoggerMessage(EventId = 2100, Level = LogLevel.Information, Message = "Broker: connecting to {Host}:{Port} as {ClientId} (TLS {UseTls}, MQTT {Protocol}, session expiry {SessionExpirySeconds} s)")]
    public static partial void Connecting(ILogger logger, string host, int port, string clientId, bool useTls, string protocol, uint sessionExpirySeconds);

    [LoggerMessage(EventId = 2101, Level = LogLevel.Information, Message = "Broker: connected (session present {SessionPresent}, broker receive maximum {BrokerReceiveMaximum})")]
    public static partial void Connected(ILogger logger, bool sessionPresent, int brokerReceiveMaximum);

    [LoggerMessage(EventId = 2102, Level = LogLevel.Warning, Message = "Broker: connection failed: {Error}; next attempt in {DelayMs} ms")]
    public static partial void ConnectFailed(ILogger logger, string error, long delayMs);

    [LoggerMessage(EventId = 2103, Level = LogLevel.Warning, Message = "Broker: disconnected ({Reason}); reconnecting")]
    public static partial void Disconnected(ILogger logger, string reason);

    [LoggerMessage(EventId = 2104, Level = LogLevel.Warning, Message = "Broker: subscription to {Topic} refused ({ResultCode})")]
    public static partial void SubscribeRefused(ILogger logger, string topic, string resultCode);

    [LoggerMessage(EventId = 2105, Level = LogLevel.Warning, Message = "Broker: publish to {Topic} failed: {Error}")]
    public static partial void PublishFailed(ILogger logger, string topic, string error);

    [LoggerMessage(EventId = 2106, Level = LogLevel.Warning, Message = "Broker: the broker did not keep the session although one was requested; messages sent while the daemon was away may be lost")]
    public static partial void SessionNotKept(ILogger logger);

    [LoggerMessage(EventId = 2200, Level = LogLevel.Information, Message = "Embedded broker listening on {Address}:{Port} (sessions in memory only)")]
    public static partial void EmbeddedStarted(ILogger logger, string address, int port);

    [LoggerMessage(EventId = 2300, Level = LogLevel.Information, Message = "Run {RunName} started on {Chamber} ({Source})")]
    public static partial void RunStarted(ILogger logger, string runName, string chamber, string source);

    [LoggerMessage(EventId = 2301, Level = LogLevel.Information, Message = "Run {RunName} on {Chamber} closed ({EndReason}): L_eff {LEffNm} nm, L_nom {LNomNm} nm, T_eff {TEffC} degC, coverage {CoveragePercent} %")]
    public static partial void RunClosed(ILogger logger, string runName, string chamber, string endReason, double? lEffNm, double? lNomNm, double? tEffC, double? coveragePercent);

    [LoggerMessage(EventId = 2302, Level = LogLevel.Error, Message = "Could not store or evaluate run {RunName}; will retry")]
    public static partial void RunStoreFailed(ILogger logger, string runName, Exception exception);

    [LoggerMessage(EventId = 2400, Level = LogLevel.Warning, Message = "Alert {Kind} on {Chamber}: {State}: {Message}")]
    public static partial void AlertChanged(ILogger logger, string kind, string chamber, string state, string message);

    [LoggerMessage(EventId = 2401, Level = LogLevel.Error, Message = "Alert sink {Sink} failed for alert {AlertId}")]
    public static partial void AlertSinkFailed(ILogger logger, string sink, long alertId, Exception exception);

    [LoggerMessage(EventId = 2405, Level = LogLevel.Error, Message = "Could not write alert {Kind} to the alert journal {Path}; it is published, and stored once the store can be written")]
    public static partial void AlertJournalFailed(ILogger logger, string kind, string path);

    [LoggerMessage(EventId = 2406, Level = LogLevel.Warning, Message = "Found {Count} alert change(s) journalled but not stored at the last stop; storing them now")]
    public static partial void AlertJournalReplayed(ILogger logger, int count);

    [LoggerMessage(EventId = 2402, Level = LogLevel.Error, Message = "Could not store alert {Kind} on {Chamber}; will retry")]
    public static partial void AlertStoreFailed(ILogger logger, string kind, string chamber, Exception exception);

    [LoggerMessage(EventId = 2500, Level = LogLevel.Warning, Message = "Retention step failed; will retry at the next interval")]
    public static partial void RetentionFailed(ILogger logger, Exception exception);

    [LoggerMessage(EventId = 2610, Level = LogLevel.Warning, Message = "Accepted diffusion model {Id} of process {Process} cannot be used ({Reason}); skipped")]
    public static partial void DiffusionModelSkipped(ILogger logger, long id, string process, string reason);

    [LoggerMessage(EventId = 2611, Level = LogLevel.Warning, Message = "Run {Run}: the diffusion-model run-end estimate failed ({Reason})")]
    public static partial void DiffusionEstimateFailed(ILogger logger, string run, string reason);
}
