namespace RunWatch.Web.Security;

/// <summary>Where a state-changing request came from, as far as its headers tell.</summary>
internal enum OriginVerdict
{
    /// <summary>Origin (or Sec-Fetch-Site) says this server's own pages.</summary>
    SameOrigin,

    /// <summary>A browser sent it from another origin (another port of the same host counts).</summary>
    CrossOrigin,

    /// <summary>Neither header: not a current browser; the antiforgery token decides.</summary>
    NoBrowserEvidence,
}
