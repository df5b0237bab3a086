namespace RunWatch.Web.Api;

/// <summary>Body of a shelve request: why, and for how many hours.</summary>
public sealed record ShelveRequest(string Comment, double Hours);
