namespace RunWatch.Web.Data;

/// <summary>
/// Reads across the lab's records for the wafer list, the wafer map, the trends and the run comparison. The daemon
/// implements it over the store (<see cref="Store.StoreLabRecords"/>); tests implement it in memory. Thread-safe.
/// </summary>
public interface ILabRecordQueries
{
    /// <summary>Every wafer known, newest first.</summary>
    Task<IReadOnlyList<WaferListRow>> ListWafersAsync(CancellationToken cancellationToken);

    /// <summary>A wafer's fields at their stored positions with their figures and verdicts; null if the wafer is unknown.</summary>
    Task<WaferMapView?> GetWaferMapAsync(string waferId, CancellationToken cancellationToken);

    /// <summary>One point per run with wafer figures or thermal figures, oldest first.</summary>
    Task<IReadOnlyList<RunTrendPoint>> GetRunTrendPointsAsync(CancellationToken cancellationToken);
}
