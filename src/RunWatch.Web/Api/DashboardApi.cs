using System.Security.Claims;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Http;
using Microsoft.AspNetCore.Routing;
using Microsoft.Extensions.Options;
using RunWatch.Web.Charting;
using RunWatch.Web.Data;
using RunWatch.Web.Security;

namespace RunWatch.Web.Api;

/// <summary>The REST API under /api: JSON, cookie-authenticated, with the same roles as the pages.</summary>
public static class DashboardApi
{
    public static IEndpointRouteBuilder MapDashboardApi(this IEndpointRouteBuilder endpoints)
    {
        var api = endpoints.MapGroup("/api").RequireAuthorization().WithTags("RunWatch");
        // JSON bodies need a preflight from other origins and the cookie is SameSite=Strict, so the API needs no form token.
        api.DisableAntiforgery();

        api.MapGet("/chambers", (IDashboardQueries q, CancellationToken ct) => q.GetChambersAsync(ct));
        api.MapGet("/runs", (IDashboardQueries q, CancellationToken ct) => q.GetRunsAsync(ct));
        api.MapGet("/runs/{runId}", async (string runId, IDashboardQueries q, CancellationToken ct) =>
            await q.GetRunAsync(runId, ct) is { } run ? Results.Ok(run) : Results.NotFound());
        api.MapGet("/runs/{runId}/samples", async (string runId, string? channel, DateTimeOffset? from, DateTimeOffset? to, int? maxPoints,
            IDashboardQueries q, IOptions<DashboardOptions> options, CancellationToken ct) =>
        {
            if (await q.GetRunAsync(runId, ct) is not { } run)
            {
                return Results.NotFound();
            }
            int max = Math.Clamp(maxPoints ?? options.Value.MaxChartPoints, 3, options.Value.MaxChartPoints);
            var samples = await q.GetSamplesAsync(run.Summary.Chamber, channel ?? run.TemperatureChannel,
                from ?? run.Summary.Start, to ?? run.Summary.End ?? DateTimeOffset.UtcNow, ct);
            var indices = new int[Math.Min(max, samples.UnixSeconds.Length)];
            int n = Core.Charting.Lttb.SelectIndices(samples.UnixSeconds, samples.Values, indices);
            return Results.Ok(new
            {
                channel = channel ?? run.TemperatureChannel,
                sourcePoints = samples.UnixSeconds.Length,
                t = indices.Take(n).Select(i => DateTimeOffset.FromUnixTimeMilliseconds((long)Math.Round(samples.UnixSeconds[i] * 1000))),
                v = indices.Take(n).Select(i => samples.Values[i]),
            });
        });
        api.MapGet("/wafers/{waferId}", async (string waferId, IDashboardQueries q, CancellationToken ct) =>
            await q.GetWaferAsync(waferId, ct) is { } wafer ? Results.Ok(wafer) : Results.NotFound());
        api.MapGet("/wafers/{waferId}/reports/{format}", async (string waferId, string format, IDashboardQueries q, CancellationToken ct) =>
            await q.GetReportAsync(waferId, format.ToLowerInvariant(), ct) is { } report
                ? Results.File(report.Content, report.ContentType, report.FileName)
                : Results.NotFound());
        api.MapGet("/fields/{fieldId}/image", async (string fieldId, bool? overlay, IDashboardQueries q, CancellationToken ct) =>
            await q.GetFieldImageAsync(fieldId, overlay ?? false, ct) is { } image ? Results.File(image.Content, image.ContentType) : Results.NotFound());
        api.MapGet("/alerts", (IDashboardQueries q, CancellationToken ct) => q.GetAlertsAsync(ct));
        api.MapGet("/export/runs.csv", async (IDashboardQueries q, CancellationToken ct) =>
            Results.Text(CsvExport.Runs(await q.GetRunsAsync(ct)), "text/csv; charset=utf-8"));
        api.MapGet("/export/alerts.csv", async (IDashboardQueries q, CancellationToken ct) =>
            Results.Text(CsvExport.Alerts(await q.GetAlertsAsync(ct)), "text/csv; charset=utf-8"));
        api.MapLabRecordsApi();

        var act = api.MapGroup("").RequireAuthorization(DashboardRoles.CanActPolicy);
        act.MapPost("/alerts/{alertId}/acknowledge", (string alertId, CommentRequest body, ClaimsPrincipal user, IDashboardCommands c, CancellationToken ct) =>
            Guarded(() => c.AcknowledgeAlertAsync(alertId, user.Identity!.Name!, body.Comment ?? "", ct)));
        act.MapPost("/alerts/{alertId}/shelve", (string alertId, ShelveRequest body, ClaimsPrincipal user, IDashboardCommands c,
            TimeProvider time, IOptions<DashboardOptions> options, CancellationToken ct) =>
        {
            if (string.IsNullOrWhiteSpace(body.Comment))
            {
                return Task.FromResult(Results.Problem("Shelving needs a comment saying why.", statusCode: StatusCodes.Status400BadRequest));
            }
            if (body.Hours <= 0 || TimeSpan.FromHours(body.Hours) > options.Value.MaxShelveDuration)
            {
                return Task.FromResult(Results.Problem($"Shelve for more than 0 and at most {options.Value.MaxShelveDuration.TotalHours} h.", statusCode: StatusCodes.Status400BadRequest));
            }
            return Guarded(() => c.ShelveAlertAsync(alertId, user.Identity!.Name!, body.Comment, time.GetUtcNow().AddHours(body.Hours), ct));
        });
        act.MapPost("/fields/{fieldId}/assign", (string fieldId, AssignRequest body, ClaimsPrincipal user, IDashboardCommands c, CancellationToken ct) =>
            Guarded(() => c.AssignFieldAsync(fieldId, body.WaferId, user.Identity!.Name!, ct)));
        act.MapPost("/models/{process}/accept", (string process, ClaimsPrincipal user, IDashboardCommands c, CancellationToken ct) =>
            Guarded(() => c.AcceptModelAsync(process, user.Identity!.Name!, ct)));
        act.MapPost("/models/{process}/refit", (string process, ClaimsPrincipal user, IDashboardCommands c, CancellationToken ct) =>
            Guarded(() => c.RefitModelAsync(process, user.Identity!.Name!, ct)));

        api.MapGet("/specs", (IDashboardQueries q, CancellationToken ct) => q.GetSpecsAsync(ct));
        // An invalid edit is the caller's error (400), not a conflict.
        api.MapPost("/specs", async (SpecEntry body, ClaimsPrincipal user, IDashboardCommands c, CancellationToken ct) =>
        {
            try
            {
                await c.UpdateSpecAsync(body, user.Identity!.Name!, ct);
                return Results.NoContent();
            }
            catch (ArgumentException ex)
            {
                return Results.Problem(ex.Message, statusCode: StatusCodes.Status400BadRequest);
            }
            catch (KeyNotFoundException ex)
            {
                return Results.Problem(ex.Message, statusCode: StatusCodes.Status404NotFound);
            }
            catch (InvalidOperationException ex)
            {
                return Results.Problem(ex.Message, statusCode: StatusCodes.Status409Conflict);
            }
        }).RequireAuthorization(DashboardRoles.AdminPolicy);
        api.MapGet("/audit", (IDashboardQueries q, CancellationToken ct) => q.GetAuditAsync(500, ct)).RequireAuthorization(DashboardRoles.AdminPolicy);
        return endpoints;
    }

    private static async Task<IResult> Guarded(Func<Task> action)
    {
        try
        {
            await action();
            return Results.NoContent();
        }
        catch (KeyNotFoundException ex)
        {
            return Results.Problem(ex.Message, statusCode: StatusCodes.Status404NotFound);
        }
        catch (Exception ex) when (ex is InvalidOperationException or ArgumentException)
        {
            return Results.Problem(ex.Message, statusCode: StatusCodes.Status409Conflict);
        }
    }
}
