namespace RunWatch.Web.Data;

/// <summary>QC verdict of a wafer.</summary>
public enum VerdictOutcome
{
    Pass,
    Review,
    Fail,
}
