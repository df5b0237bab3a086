namespace RunWatch.Web.Security;

/// <summary>A dashboard user: name, role and the framework password hasher's hash (never the password).</summary>
public sealed record DashboardUser(string Name, string Role, string PasswordHash);
