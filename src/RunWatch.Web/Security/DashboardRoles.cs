namespace RunWatch.Web.Security;

/// <summary>Roles and the authorisation policies built on them.</summary>
public static class DashboardRoles
{
    public const string Viewer = "viewer";
    public const string Engineer = "engineer";
    public const string Admin = "admin";

    /// <summary>Policy for write actions: acknowledge, shelve, assign fields, refit and accept models.</summary>
    public const string CanActPolicy = "runwatch-can-act";

    /// <summary>Policy for editing specs and reminder rules.</summary>
    public const string AdminPolicy = "runwatch-admin";

    /// <summary>All roles, lowest first.</summary>
    public static IReadOnlyList<string> All { get; } = [Viewer, Engineer, Admin];

    /// <summary>Whether a role may perform write actions.</summary>
    public static bool CanAct(string role) => role is Engineer or Admin;
}
