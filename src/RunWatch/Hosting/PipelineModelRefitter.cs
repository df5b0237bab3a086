using RunWatch.Wafers.Pipeline;
using RunWatch.Web.Data;

namespace RunWatch.Hosting;

/// <summary>The dashboard's refit, carried out by the wafer pipeline's calibration over the process's stored wafers.</summary>
internal sealed class PipelineModelRefitter(ProcessCalibrationService calibration) : IModelRefitter
{
    public async Task<string> RefitAsync(string process, CancellationToken cancellationToken)
    {
        ProcessRefit refit = await calibration.RefitAsync(process, cancellationToken).ConfigureAwait(false);
        return refit.Describe();
    }
}
