using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Mvc;
using Microsoft.AspNetCore.Http;
using Microsoft.AspNetCore.Routing;
using RunWatch.Web.Data;

namespace RunWatch.Web.Api;

/// <summary>The wafer list, wafer maps and run trend figures under /api (read-only, any logged-in role).</summary>
public static class LabRecordsApi
{
    public static RouteGroupBuilder MapLabRecordsApi(this RouteGroupBuilder api)
    {
        ArgumentNullException.ThrowIfNull(api);
        api.MapGet("/wafers", ([FromServices] ILabRecordQueries q, CancellationToken ct) => q.ListWafersAsync(ct));
        api.MapGet("/wafers/{waferId}/map", async (string waferId, [FromServices] ILabRecordQueries q, CancellationToken ct) =>
            await q.GetWaferMapAsync(waferId, ct) is { } map ? Results.Ok(map) : Results.NotFound());
        api.MapGet("/trends/runs", ([FromServices] ILabRecordQueries q, CancellationToken ct) => q.GetRunTrendPointsAsync(ct));
        api.MapGet("/export/wafers.csv", async ([FromServices] ILabRecordQueries q, CancellationToken ct) =>
            Results.Text(CsvExport.Wafers(await q.ListWafersAsync(ct)), "text/csv; charset=utf-8"));
        return api;
    }
}
