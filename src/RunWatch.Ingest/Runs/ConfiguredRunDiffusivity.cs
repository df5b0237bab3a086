using RunWatch.Core.Thermal;
using RunWatch.Ingest.Chambers;
using RunWatch.Storage;

namespace RunWatch.Ingest.Runs;

/// <summary>The chamber's configured process diffusivity (<c>Process</c> section), for every run.</summary>
internal sealed class ConfiguredRunDiffusivity : IRunDiffusivity
{
    public ValueTask<ArrheniusDiffusivity> ForRunAsync(ChamberRuntime chamber, RunRecord run, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(chamber);
        return ValueTask.FromResult(chamber.Options.Process.Diffusivity);
    }
}
