namespace RunWatch.Ingest.Configuration;

/// <summary>Where run boundaries come from.</summary>
public enum RunDetectionMode
{
    /// <summary>run-start and run-end events.</summary>
    Events = 0,

    /// <summary>The growth-shutter channel: open starts a run, closed for the debounce time ends it.</summary>
    Shutter,
}
