using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Http;
using Microsoft.AspNetCore.Routing;
using RunWatch.Web.Data.Fields;

namespace RunWatch.Web.Api;

/// <summary>
/// <c>GET /api/fields/{id}/full?layer=plain|analysis</c>: a field's image at full resolution for the viewer, as
/// recorded (a TIFF is rendered to PNG) or with the analysis drawn in. Logged-in users; 404 when not available.
/// </summary>
public static class FieldViewerApi
{
    public static IEndpointRouteBuilder MapFieldViewerApi(this IEndpointRouteBuilder endpoints)
    {
        ArgumentNullException.ThrowIfNull(endpoints);
        endpoints.MapGet("/api/fields/{fieldId}/full", async (string fieldId, string? layer, HttpContext http, CancellationToken ct) =>
        {
            if (http.RequestServices.GetService(typeof(IFieldDetails)) is not IFieldDetails details)
            {
                return Results.NotFound();
            }
            if (layer is not (null or "plain" or "analysis"))
            {
                return Results.Problem("layer is plain or analysis", statusCode: StatusCodes.Status400BadRequest);
            }
            var image = await details.GetFullImageAsync(fieldId, layer == "analysis", ct).ConfigureAwait(false);
            if (image is null)
            {
                return Results.NotFound();
            }
            http.Response.Headers.CacheControl = "private, max-age=60";
            return Results.File(image.Content, image.ContentType);
        }).RequireAuthorization().WithTags("RunWatch");
        return endpoints;
    }
}
