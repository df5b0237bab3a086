namespace RunWatch.Storage;

/// <summary>Whether a run is still going on.</summary>
public enum RunStatus
{
    /// <summary>Started, not yet ended.</summary>
    Open = 0,

    /// <summary>Ended; its thermal figures are computed.</summary>
    Closed,
}
