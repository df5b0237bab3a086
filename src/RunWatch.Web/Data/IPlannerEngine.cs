namespace RunWatch.Web.Data;

/// <summary>The what-if computation behind the planner: the current process model applied to planned inputs.</summary>
public interface IPlannerEngine
{
    /// <exception cref="ArgumentException">Inputs out of range, with a plain message.</exception>
    Task<PlannerResult> PredictAsync(PlannerInput input, CancellationToken cancellationToken);
}
