namespace RunWatch.Web.Data;

/// <summary>Assigns an unmatched SEM field to a wafer (implemented by the wafer pipeline in the host).</summary>
public interface IFieldAssigner
{
    /// <exception cref="InvalidOperationException">The assignment cannot be made; the message says why.</exception>
    Task AssignAsync(long fieldId, string waferId, string user, CancellationToken cancellationToken);
}
