namespace RunWatch.Ingest.Runs;

/// <summary>Store work for the tracking service: save an opened run, or evaluate and save a closed one.</summary>
/// <param name="Run">The run.</param>
/// <param name="Close">True to evaluate the run's thermal figures and store it closed.</param>
internal sealed record RunWork(TrackedRun Run, bool Close);
