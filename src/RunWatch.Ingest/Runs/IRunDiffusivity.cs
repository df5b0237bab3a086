using RunWatch.Core.Thermal;
using RunWatch.Ingest.Chambers;
using RunWatch.Storage;

namespace RunWatch.Ingest.Runs;

/// <summary>
/// The seam through which a run's end-of-run evaluation gets its process diffusivity. The default
/// (<see cref="ConfiguredRunDiffusivity"/>) is the chamber's configured process; an implementation that returns an
/// accepted Arrhenius calibration of the run's process (Core <c>ArrheniusFit.ToDiffusivity</c> of the accepted
/// <see cref="ModelKinds.Arrhenius"/> fit) replaces it by registering itself before <c>AddRunWatchIngest</c>.
/// </summary>
internal interface IRunDiffusivity
{
    /// <summary>The diffusivity for <paramref name="run"/> of <paramref name="chamber"/>.</summary>
    ValueTask<ArrheniusDiffusivity> ForRunAsync(ChamberRuntime chamber, RunRecord run, CancellationToken cancellationToken);
}
