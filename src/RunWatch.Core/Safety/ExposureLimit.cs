namespace RunWatch.Core.Safety;

/// <summary>One published occupational exposure limit, always with its body, averaging time, source and year.</summary>
/// <param name="Substance">Substance as the source names it.</param>
/// <param name="Body">Publishing body, for example "OSHA".</param>
/// <param name="Kind">Kind of limit as the body names it: PEL, REL, TLV, IDLH, action level.</param>
/// <param name="Value">Numeric value in <paramref name="Unit"/>.</param>
/// <param name="Unit">"ppm" or "mg/m³".</param>
/// <param name="Averaging">Averaging time, for example "8-h TWA", "ceiling, 15 min", "IDLH".</param>
/// <param name="Source">Where the value was read.</param>
/// <param name="Year">Year or edition of the source.</param>
/// <param name="Note">Caveat shown with the value, or empty.</param>
public sealed record ExposureLimit(
    string Substance,
    string Body,
    string Kind,
    double Value,
    string Unit,
    string Averaging,
    string Source,
    string Year,
    string Note = "");
