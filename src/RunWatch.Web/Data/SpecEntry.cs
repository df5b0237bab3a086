namespace RunWatch.Web.Data;

/// <summary>
/// A QC specification limit, editable by admins: the fail window [Min, Max] and the optional, stricter warn window
/// [WarnMin, WarnMax], in <paramref name="Unit"/>, of one rule of one recipe ("" is the default specification).
/// <paramref name="Sides"/> says which limits the rule has; <paramref name="HasWarn"/> whether it has a warn window.
/// </summary>
public sealed record SpecEntry(string Name, double? Min, double? Max, string Unit, double? WarnMin = null, double? WarnMax = null,
    string Recipe = "", SpecSides Sides = SpecSides.Both, bool HasWarn = true)
{
    /// <summary>Identifies the row across recipes.</summary>
    public string Key => Recipe + "\u001f" + Name;
}
