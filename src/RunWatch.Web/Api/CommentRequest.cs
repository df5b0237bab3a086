namespace RunWatch.Web.Api;

/// <summary>Body of an acknowledge request.</summary>
public sealed record CommentRequest(string? Comment);
