using RunWatch.Core.Model.Diffusion;

namespace RunWatch.Ingest.Runs;

/// <summary>The seam through which a run's end-of-run evaluation finds its process's accepted diffusion radius model.</summary>
internal interface IRunDiffusionModels
{
    /// <summary>The newest accepted model of <paramref name="process"/> with its record id, or null when none is accepted.</summary>
    ValueTask<(long Id, DiffusionModelParams Params)?> AcceptedForAsync(string process, CancellationToken cancellationToken);
}
