namespace RunWatch.Web.Data;

/// <summary>Refits a process's radius model and Arrhenius calibration from its stored wafers (implemented by the wafer pipeline in the host).</summary>
public interface IModelRefitter
{
    /// <summary>Stores the refit as proposals (not accepted) and returns one sentence describing them, for the audit log.</summary>
    /// <exception cref="InvalidOperationException">Nothing could be fitted; the message says what is missing.</exception>
    Task<string> RefitAsync(string process, CancellationToken cancellationToken);
}
