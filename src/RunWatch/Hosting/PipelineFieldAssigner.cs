using RunWatch.Wafers.Pipeline;
using RunWatch.Web.Data;

namespace RunWatch.Hosting;

/// <summary>The dashboard's field assignment, carried out by the wafer pipeline (which records who did it).</summary>
internal sealed class PipelineFieldAssigner(FieldIntake intake) : IFieldAssigner
{
    public async Task AssignAsync(long fieldId, string waferId, string user, CancellationToken cancellationToken)
    {
        try
        {
            await intake.AssignAsync(fieldId, waferId, user, cancellationToken).ConfigureAwait(false);
        }
        catch (KeyNotFoundException ex)
        {
            throw new InvalidOperationException(ex.Message, ex);
        }
    }
}
