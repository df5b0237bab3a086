namespace RunWatch.Web.Data;

/// <summary>The interval in which material was deposited (growth shutter open).</summary>
public sealed record GrowthWindow(DateTimeOffset Start, DateTimeOffset End);
