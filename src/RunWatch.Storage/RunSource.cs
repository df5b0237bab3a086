namespace RunWatch.Storage;

/// <summary>How a run was detected.</summary>
public enum RunSource
{
    /// <summary>From run-start/run-end events.</summary>
    Events = 0,

    /// <summary>From the growth-shutter channel.</summary>
    Shutter,
}
