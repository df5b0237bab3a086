namespace RunWatch.Web.Live;

/// <summary>What changed.</summary>
public enum LiveUpdateKind
{
    Samples,
    Alerts,
    Runs,
}
