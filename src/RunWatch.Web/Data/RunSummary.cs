namespace RunWatch.Web.Data;

/// <summary>A run as the runs table lists it. Planned duration is the recipe's growth time.</summary>
public sealed record RunSummary(string RunId, string Chamber, string Recipe, DateTimeOffset Start, DateTimeOffset? End, double SetpointC, TimeSpan Planned, GrowthWindow? Window, IReadOnlyList<string> Wafers, int Excursions, string? Verdict);
