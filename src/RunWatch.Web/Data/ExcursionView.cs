namespace RunWatch.Web.Data;

/// <summary>A temperature excursion: its span, largest deviation and its effect on L_eff.</summary>
public sealed record ExcursionView(DateTimeOffset Start, DateTimeOffset End, double PeakDeviationK, AlertSeverity Severity, double EffectOnLPercent, bool InGrowthWindow = true,
    bool SuppressedByDesign = false);
