namespace RunWatch.Storage;

/// <summary>Why a run was closed.</summary>
public enum RunEndReason
{
    /// <summary>A run-end event arrived.</summary>
    EndEvent = 0,

    /// <summary>The growth shutter closed.</summary>
    ShutterClosed,

    /// <summary>No end came within the timeout rule; the run was closed by the daemon and is marked so.</summary>
    Timeout,

    /// <summary>A new run-start arrived for the same chamber before this run ended.</summary>
    Superseded,
}
