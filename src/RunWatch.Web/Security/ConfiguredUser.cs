namespace RunWatch.Web.Security;

/// <summary>A user as written in configuration (section RunWatch:Dashboard:Users).</summary>
public sealed class ConfiguredUser
{
    public string Name { get; set; } = "";

    /// <summary>viewer, engineer or admin.</summary>
    public string Role { get; set; } = DashboardRoles.Viewer;

    /// <summary>Hash from ASP.NET Core Identity's PasswordHasher (v3 format, base64); see docs/dashboard.md.</summary>
    public string PasswordHash { get; set; } = "";
}
