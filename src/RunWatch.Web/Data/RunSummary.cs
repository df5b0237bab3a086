namespace RunWatch.Web.Data;

/// <summary>A run as the runs table lists it. Planned duration is the recipe's growth time; <c>LEffNm</c> the effective diffusion length λ_eff once the run is evaluated.</summary>
public sealed record RunSummary(string RunId, string Chamber, string Recipe, DateTimeOffset Start, DateTimeOffset? End, double SetpointC, TimeSpan Planned, GrowthWindow? Window, IReadOnlyList<string> Wafers, int Excursions, string? Verdict,
    double? LEffNm = null);
