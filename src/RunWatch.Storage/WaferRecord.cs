namespace RunWatch.Storage;

/// <summary>A wafer known to the pipeline.</summary>
/// <param name="Id">Store id.</param>
/// <param name="Name">Wafer id as written by the lab (e.g. W-0412-A).</param>
/// <param name="RunId">The run whose events named it, if known.</param>
/// <param name="Process">Process (recipe family) whose radius model applies, if known.</param>
/// <param name="CreatedAt">When the store first heard of it.</param>
public sealed record WaferRecord(long Id, string Name, long? RunId, string? Process, DateTimeOffset CreatedAt);
