namespace RunWatch.Web.Data;

/// <summary>One setting in force, as shown read-only (secrets never included).</summary>
public sealed record ConfigurationItem(string Key, string Value);
