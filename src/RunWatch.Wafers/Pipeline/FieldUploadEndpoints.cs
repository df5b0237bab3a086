using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Http;
using Microsoft.AspNetCore.Routing;

namespace RunWatch.Wafers.Pipeline;

/// <summary>
/// <c>POST /api/fields/upload?name=FILE</c>: an SEM image as the raw request body (for lab systems that push
/// rather than copy into the drop folder). The file lands in the drop folder's <c>uploads</c> subfolder under its
/// checked name and is taken in at once; an existing file is never overwritten.
/// </summary>
public static class FieldUploadEndpoints
{
    public static RouteHandlerBuilder MapRunWatchFieldUpload(this IEndpointRouteBuilder endpoints)
    {
        ArgumentNullException.ThrowIfNull(endpoints);
        return endpoints.MapPost("/api/fields/upload", UploadAsync).DisableAntiforgery();
    }

    /// <summary><c>GET /api/pipeline</c>: the analysis queue's progress (waiting, running, done, failed).</summary>
    public static RouteHandlerBuilder MapRunWatchPipelineProgress(this IEndpointRouteBuilder endpoints) =>
        endpoints.MapGet("/api/pipeline", (FieldAnalysisQueue queue) => Results.Json(new
        {
            queue.Capacity,
            queue.Waiting,
            queue.Running,
            queue.Enqueued,
            queue.Done,
            queue.Failed,
        }));

    /// <summary><c>POST /api/wafers/{wafer}/reanalyse[?reason=…]</c>: analyse every field of a wafer again (new settings or model), on request only; the next report revision records who asked and why.</summary>
    public static RouteHandlerBuilder MapRunWatchReanalyse(this IEndpointRouteBuilder endpoints) =>
        endpoints.MapPost("/api/wafers/{wafer}/reanalyse", async (string wafer, string? reason, HttpContext context, FieldIntake intake, CancellationToken cancellationToken) =>
        {
            string actor = context.User.Identity?.Name ?? "unknown";
            // The reason goes into the report's record; keep it one short line.
            string? note = reason is { Length: > 0 } ? new string([.. reason.Take(200).Where(c => !char.IsControl(c))]) : null;
            int queued = await intake.ReanalyseWaferAsync(wafer, actor, note, cancellationToken).ConfigureAwait(false);
            return queued == 0 ? Results.NotFound(new { wafer, queued }) : Results.Accepted(value: new { wafer, queued });
        });

    internal static async Task<IResult> UploadAsync(HttpRequest request, string? name, FieldUploader uploader, CancellationToken cancellationToken)
    {
        if (request.ContentLength is { } length && length > uploader.MaxBytes)
        {
            return Results.Problem($"upload larger than {uploader.MaxBytes} bytes", statusCode: StatusCodes.Status413PayloadTooLarge);
        }
        FieldUploadOutcome outcome = await uploader.UploadAsync(name, request.Body, sidecar: null, checkImage: false, cancellationToken).ConfigureAwait(false);
        if (outcome.Field is not { } field)
        {
            string problem = outcome.Problem ?? "refused";
            // The API's earlier wording for a missing name, kept for lab scripts that match on it.
            if (problem.StartsWith("give the image's file name", StringComparison.Ordinal))
            {
                problem = "give the image's file name as ?name=..., without folders";
            }
            return Results.Problem(problem, statusCode: outcome.StatusCode);
        }
        return Results.Json(new { field.Id, field.Wafer, Status = field.Status.ToString(), field.Problem, Added = outcome.Added }, statusCode: outcome.StatusCode);
    }
}
