namespace RunWatch.Web.Data;

/// <summary>Which limits a specification row has.</summary>
public enum SpecSides
{
    /// <summary>A lower and an upper limit.</summary>
    Both,

    /// <summary>A lower limit only (a minimum).</summary>
    Lower,

    /// <summary>An upper limit only (a maximum).</summary>
    Upper,
}
