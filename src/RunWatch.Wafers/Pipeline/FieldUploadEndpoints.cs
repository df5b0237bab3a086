using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Http;
using Microsoft.AspNetCore.Routing;
using Microsoft.Extensions.Options;
using RunWatch.Wafers.Intake;
using RunWatch.Storage;

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

    internal static async Task<IResult> UploadAsync(HttpRequest request, string? name, FieldIntake intake, FieldIntakeService watcher,
        IOptions<IntakeOptions> options, CancellationToken cancellationToken)
    {
        if (string.IsNullOrEmpty(name) || name.Contains('/', StringComparison.Ordinal) || name.Contains('\\', StringComparison.Ordinal))
        {
            return Results.Problem("give the image's file name as ?name=..., without folders", statusCode: StatusCodes.Status400BadRequest);
        }
        if (FieldFileNameCheck.Refusal(name) is { } refusal)
        {
            return Results.Problem("file name refused: " + refusal, statusCode: StatusCodes.Status400BadRequest);
        }
        long limit = options.Value.MaxUploadBytes;
        if (request.ContentLength is { } length && length > limit)
        {
            return Results.Problem($"upload larger than {limit} bytes", statusCode: StatusCodes.Status413PayloadTooLarge);
        }
        string folder = Path.Combine(watcher.DropFolder, "uploads");
        Directory.CreateDirectory(folder);
        string? path = FieldFileNameCheck.ResolveInside(folder, name);
        if (path is null)
        {
            return Results.Problem("file name refused: path leaves the upload folder", statusCode: StatusCodes.Status400BadRequest);
        }
        string partial = Path.Combine(folder, "." + Guid.NewGuid().ToString("N") + ".partial");
        long written = 0;
        try
        {
            await using (var output = new FileStream(partial, FileMode.CreateNew, FileAccess.Write, FileShare.None, 1 << 16, useAsync: true))
            {
                byte[] buffer = new byte[1 << 16];
                int read;
                while ((read = await request.Body.ReadAsync(buffer, cancellationToken).ConfigureAwait(false)) > 0)
                {
                    written += read;
                    if (written > limit)
                    {
                        return Results.Problem($"upload larger than {limit} bytes", statusCode: StatusCodes.Status413PayloadTooLarge);
                    }
                    await output.WriteAsync(buffer.AsMemory(0, read), cancellationToken).ConfigureAwait(false);
                }
            }
            if (written == 0)
            {
                return Results.Problem("empty upload", statusCode: StatusCodes.Status400BadRequest);
            }
            try
            {
                File.Move(partial, path, overwrite: false);
            }
            catch (IOException)
            {
                return Results.Problem($"a file named {name} was uploaded before; rename the new one", statusCode: StatusCodes.Status409Conflict);
            }
            var info = new FileInfo(path);
            var (field, added) = await intake.TakeInAsync(
                new ArrivedField(path, Path.GetRelativePath(watcher.DropFolder, path), info.Length, info.LastWriteTimeUtc), cancellationToken).ConfigureAwait(false);
            return Results.Json(new { field.Id, field.Wafer, Status = field.Status.ToString(), field.Problem, Added = added },
                statusCode: added ? StatusCodes.Status201Created : StatusCodes.Status200OK);
        }
        finally
        {
            if (File.Exists(partial))
            {
                File.Delete(partial);
            }
        }
    }
}
