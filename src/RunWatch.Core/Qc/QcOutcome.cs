namespace RunWatch.Core.Qc;

/// <summary>Outcome of one QC rule or of the whole verdict, ordered from best to worst.</summary>
public enum QcOutcome
{
    /// <summary>Within the limit and outside the warn band.</summary>
    Pass = 0,

    /// <summary>Within the limit but inside the warn band, or a measurement is missing (by default).</summary>
    Warn = 1,

    /// <summary>Beyond the limit.</summary>
    Fail = 2,
}
