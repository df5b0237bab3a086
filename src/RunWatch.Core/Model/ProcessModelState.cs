namespace RunWatch.Core.Model;

/// <summary>
/// The model state of one process: the accepted calibration in use, and at most one proposed candidate awaiting a
/// person's decision. Immutable: every transition returns a new state. A fit never replaces the accepted one by
/// itself; only <see cref="Accept"/>, naming the candidate's id and the person, does.
/// </summary>
/// <param name="Process">Process / recipe family.</param>
/// <param name="Accepted">Calibration currently used for predictions, or null before the first acceptance.</param>
/// <param name="Proposed">Candidate awaiting review, or null.</param>
/// <param name="History">Previously accepted calibrations, oldest first (the current one excluded).</param>
public sealed record ProcessModelState(
    string Process,
    AcceptedCalibration? Accepted,
    CalibrationRecord? Proposed,
    IReadOnlyList<AcceptedCalibration> History)
{
    /// <summary>An empty state for a process.</summary>
    public static ProcessModelState Empty(string process)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(process);
        return new ProcessModelState(process, null, null, []);
    }

    /// <summary>Sets (or replaces) the proposed candidate. The accepted calibration is unchanged.</summary>
    /// <exception cref="ArgumentException">The candidate belongs to another process.</exception>
    public ProcessModelState Propose(CalibrationRecord candidate)
    {
        ArgumentNullException.ThrowIfNull(candidate);
        if (!string.Equals(candidate.Process, Process, StringComparison.Ordinal))
        {
            throw new ArgumentException($"Candidate is for process '{candidate.Process}', not '{Process}'.", nameof(candidate));
        }
        return this with { Proposed = candidate };
    }

    /// <summary>Makes the proposed candidate the accepted calibration; the previous one moves to the history.</summary>
    /// <param name="candidateId">Id of the candidate the person reviewed; must match the proposed one.</param>
    /// <param name="acceptedBy">Who accepts (non-empty).</param>
    /// <param name="acceptedAt">When.</param>
    /// <param name="comment">Optional reason.</param>
    /// <exception cref="InvalidOperationException">Nothing is proposed, or the id does not match the proposal.</exception>
    public ProcessModelState Accept(string candidateId, string acceptedBy, DateTimeOffset acceptedAt, string? comment = null)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(candidateId);
        ArgumentException.ThrowIfNullOrWhiteSpace(acceptedBy);
        if (Proposed is null)
        {
            throw new InvalidOperationException($"Process '{Process}' has no proposed calibration to accept.");
        }
        if (!string.Equals(Proposed.Id, candidateId, StringComparison.Ordinal))
        {
            throw new InvalidOperationException($"The proposed calibration is '{Proposed.Id}', not '{candidateId}': review the current proposal.");
        }
        var history = new List<AcceptedCalibration>(History);
        if (Accepted is not null)
        {
            history.Add(Accepted);
        }
        var accepted = new AcceptedCalibration(Proposed, new CalibrationAcceptance(acceptedBy, acceptedAt, comment));
        return new ProcessModelState(Process, accepted, null, history);
    }

    /// <summary>Drops the proposed candidate without using it.</summary>
    public ProcessModelState Discard() => this with { Proposed = null };
}
