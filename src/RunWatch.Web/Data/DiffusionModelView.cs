namespace RunWatch.Web.Data;

/// <summary>
/// A process's diffusion radius model on the Process model screen: the one in force (accepted), a newer proposal
/// awaiting acceptance, and the newest refit's refusal when it is newer than both (with its plain reason).
/// </summary>
/// <param name="Accepted">The model in force; null when none has been accepted.</param>
/// <param name="AcceptedBy">Who accepted it.</param>
/// <param name="AcceptedAt">When.</param>
/// <param name="Proposed">A proposal newer than the accepted model, or null.</param>
/// <param name="Refusal">Why the newest refit made no model, or null.</param>
/// <param name="RefusedAt">When that refit ran.</param>
public sealed record DiffusionModelView(DiffusionModelFit? Accepted, string? AcceptedBy, DateTimeOffset? AcceptedAt, DiffusionModelFit? Proposed,
    string? Refusal, DateTimeOffset? RefusedAt);
