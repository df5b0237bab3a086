namespace RunWatch.Web.Data;

/// <summary>
/// A QC specification limit, editable by admins: the fail window [Min, Max] and the optional, stricter warn window
/// [WarnMin, WarnMax], in <paramref name="Unit"/>, of one rule of one recipe ("" is the default specification).
/// </summary>
public sealed record SpecEntry(string Name, double? Min, double? Max, string Unit, double? WarnMin = null, double? WarnMax = null,
    string Recipe = "", SpecSides Sides = SpecSides.Both)
{
    /// <summary>Identifies the row across recipes.</summary>
    public string Key => Recipe + "\u001f" + Name;
}
