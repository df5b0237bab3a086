using Microsoft.AspNetCore.Http;

namespace RunWatch.Web.Security;

/// <summary>
/// Headers on every response: a Content-Security-Policy the Blazor Server pages work under (scripts and styles from
/// this origin only; inline styles allowed because Blazor and plotly.js set element styles; the circuit's WebSocket
/// to this origin), <c>X-Content-Type-Options: nosniff</c>, no framing and no referrer sent elsewhere.
/// </summary>
internal sealed class SecurityHeaders(RequestDelegate next)
{
    public const string ContentSecurityPolicy =
        "default-src 'self'; script-src 'self'; style-src 'self' 'unsafe-inline'; img-src 'self' data: blob:; font-src 'self' data:; "
        + "connect-src 'self'; object-src 'none'; base-uri 'self'; form-action 'self'; frame-ancestors 'none'";

    public Task InvokeAsync(HttpContext context)
    {
        context.Response.OnStarting(static state =>
        {
            var headers = ((HttpContext)state).Response.Headers;
            headers.ContentSecurityPolicy = ContentSecurityPolicy;
            headers.XContentTypeOptions = "nosniff";
            headers.XFrameOptions = "DENY";
            headers["Referrer-Policy"] = "same-origin";
            return Task.CompletedTask;
        }, context);
        return next(context);
    }
}
