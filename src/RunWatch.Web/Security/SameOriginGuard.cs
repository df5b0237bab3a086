using Microsoft.AspNetCore.Antiforgery;
using Microsoft.AspNetCore.Http;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;

namespace RunWatch.Web.Security;

/// <summary>
/// Refuses (403) every state-changing request (any method but GET, HEAD, OPTIONS, TRACE) that a browser sent from
/// another origin. A request passes when its <c>Origin</c> header names this server (or one of
/// <see cref="DashboardOptions.AllowedOrigins"/>), or, when it carries no <c>Origin</c> and no
/// <c>Sec-Fetch-Site</c> (a non-browser client), when it carries a valid antiforgery token. SameSite=Strict cookies
/// do not stop a page on another port of the same host (same site, other origin); this does.
/// </summary>
internal sealed partial class SameOriginGuard(RequestDelegate next, IAntiforgery antiforgery, IOptions<DashboardOptions> options, ILogger<SameOriginGuard> logger)
{
    public async Task InvokeAsync(HttpContext context)
    {
        var request = context.Request;
        if (HttpMethods.IsGet(request.Method) || HttpMethods.IsHead(request.Method) || HttpMethods.IsOptions(request.Method) || HttpMethods.IsTrace(request.Method))
        {
            await next(context).ConfigureAwait(false);
            return;
        }
        var verdict = Judge(request, options.Value.AllowedOrigins);
        if (verdict == OriginVerdict.SameOrigin
            || (verdict == OriginVerdict.NoBrowserEvidence && await antiforgery.IsRequestValidAsync(context).ConfigureAwait(false)))
        {
            await next(context).ConfigureAwait(false);
            return;
        }
        LogRefused(logger, request.Method, request.Path.Value ?? "", verdict.ToString());
        context.Response.StatusCode = StatusCodes.Status403Forbidden;
        context.Response.ContentType = "text/plain; charset=utf-8";
        await context.Response.WriteAsync(verdict == OriginVerdict.CrossOrigin
            ? "Refused: a state-changing request from another origin."
            : "Refused: a state-changing request needs an Origin header naming this server or an antiforgery token (header RequestVerificationToken).").ConfigureAwait(false);
    }

    /// <summary>What the request's headers say about where it came from.</summary>
    internal static OriginVerdict Judge(HttpRequest request, IReadOnlyList<string> allowedOrigins)
    {
        string? origin = request.Headers.Origin;
        string? fetchSite = request.Headers["Sec-Fetch-Site"];
        if (!string.IsNullOrEmpty(origin))
        {
            return IsOwnOrigin(origin, request) || Contains(allowedOrigins, origin) ? OriginVerdict.SameOrigin : OriginVerdict.CrossOrigin;
        }
        if (!string.IsNullOrEmpty(fetchSite))
        {
            // "none" is a navigation the user started (address bar, bookmark): not a forged request.
            return fetchSite is "same-origin" or "none" ? OriginVerdict.SameOrigin : OriginVerdict.CrossOrigin;
        }
        return OriginVerdict.NoBrowserEvidence;
    }

    private static bool IsOwnOrigin(string origin, HttpRequest request) =>
        request.Host.HasValue && string.Equals(origin, request.Scheme + "://" + request.Host.Value, StringComparison.OrdinalIgnoreCase);

    private static bool Contains(IReadOnlyList<string> allowed, string origin)
    {
        foreach (string a in allowed)
        {
            if (string.Equals(a.TrimEnd('/'), origin, StringComparison.OrdinalIgnoreCase))
            {
                return true;
            }
        }
        return false;
    }

    [LoggerMessage(EventId = 6020, Level = LogLevel.Warning, Message = "Refused {Method} {Path}: {Verdict}")]
    private static partial void LogRefused(ILogger logger, string method, string path, string verdict);
}
