using Microsoft.Extensions.Logging;

namespace RunWatch.Ingest.Fleet;

/// <summary>Log messages of fleet mode (event ids 2600–2649).</summary>
internal static partial class FleetLog
{
    [LoggerMessage(EventId = 2600, Level = LogLevel.Information, Message = "Chamber {Chamber}: MQTT session {ClientId} connected (session present: {SessionPresent})")]
    public static partial void ChamberSessionConnected(ILogger logger, string chamber, string clientId, bool sessionPresent);

    [LoggerMessage(EventId = 2601, Level = LogLevel.Warning, Message = "Chamber {Chamber}: MQTT session problem: {Error}")]
    public static partial void ChamberSessionError(ILogger logger, string chamber, string error);

    [LoggerMessage(EventId = 2602, Level = LogLevel.Information, Message = "Chamber {Chamber} taken over by {Instance}: state rebuilt ({OpenRuns} open run(s), {ActiveAlerts} active alert(s), {Replayed} stored sample(s) replayed) and subscribed in {Milliseconds} ms")]
    public static partial void ChamberTakenOver(ILogger logger, string chamber, string instance, int openRuns, int activeAlerts, int replayed, long milliseconds);

    [LoggerMessage(EventId = 2603, Level = LogLevel.Warning, Message = "Chamber {Chamber} is no longer owned by {Instance}; its MQTT session is closed")]
    public static partial void ChamberLost(ILogger logger, string chamber, string instance);

    [LoggerMessage(EventId = 2604, Level = LogLevel.Warning, Message = "Ownership check failed: {Error}; chambers held: {Held}")]
    public static partial void OwnershipCheckFailed(ILogger logger, string error, int held);

    [LoggerMessage(EventId = 2605, Level = LogLevel.Error, Message = "Chamber {Chamber}: takeover failed, the chamber is given back: {Error}")]
    public static partial void TakeoverFailed(ILogger logger, string chamber, string error);
}
