namespace RunWatch.Web.Api;

/// <summary>Body of a field assignment: the wafer the field belongs to.</summary>
public sealed record AssignRequest(string WaferId);
