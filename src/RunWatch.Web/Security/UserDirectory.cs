using System.Collections.Concurrent;
using System.Security.Cryptography;
using Microsoft.AspNetCore.Identity;

namespace RunWatch.Web.Security;

/// <summary>
/// The dashboard's users, held in memory: loaded from configuration at start, plus demo users in demo mode.
/// Passwords are checked with ASP.NET Core Identity's <see cref="PasswordHasher{TUser}"/>. Thread-safe.
/// </summary>
public sealed class UserDirectory
{
    private readonly ConcurrentDictionary<string, DashboardUser> _users = new(StringComparer.OrdinalIgnoreCase);
    private readonly PasswordHasher<DashboardUser> _hasher = new();

    /// <summary>Number of users known.</summary>
    public int Count => _users.Count;

    /// <summary>Adds or replaces a user whose password hash is already computed.</summary>
    /// <exception cref="ArgumentException">Empty name or hash, or unknown role.</exception>
    public void Add(DashboardUser user)
    {
        ArgumentNullException.ThrowIfNull(user);
        ArgumentException.ThrowIfNullOrWhiteSpace(user.Name);
        ArgumentException.ThrowIfNullOrWhiteSpace(user.PasswordHash);
        if (!DashboardRoles.All.Contains(user.Role))
        {
            throw new ArgumentException($"Unknown role '{user.Role}' for user '{user.Name}'; use viewer, engineer or admin.", nameof(user));
        }
        _users[user.Name] = user;
    }

    /// <summary>Adds a user with a clear-text password, hashing it.</summary>
    public void AddWithPassword(string name, string role, string password)
    {
        ArgumentException.ThrowIfNullOrEmpty(password);
        Add(new DashboardUser(name, role, HashPassword(password)));
    }

    /// <summary>Hashes a password the way configuration expects it.</summary>
    public string HashPassword(string password) => _hasher.HashPassword(new DashboardUser("", DashboardRoles.Viewer, ""), password);

    /// <summary>Returns the user if the name is known and the password matches; otherwise null.</summary>
    public DashboardUser? Verify(string name, string password)
    {
        if (string.IsNullOrEmpty(name) || string.IsNullOrEmpty(password) || !_users.TryGetValue(name, out var user))
        {
            return null;
        }
        try
        {
            return _hasher.VerifyHashedPassword(user, user.PasswordHash, password) == PasswordVerificationResult.Failed ? null : user;
        }
        catch (FormatException)
        {
            // A malformed hash in configuration refuses the login instead of failing the request.
            return null;
        }
    }

    /// <summary>Creates one demo user per role with a random password; returns the credentials to print.</summary>
    public IReadOnlyList<DemoCredential> CreateDemoUsers()
    {
        var credentials = new List<DemoCredential>();
        foreach (var role in DashboardRoles.All)
        {
            string name = "demo-" + role;
            string password = RandomNumberGenerator.GetString("abcdefghijkmnpqrstuvwxyzACDEFGHJKLMNPQRTUVWXY34679", 14);
            AddWithPassword(name, role, password);
            credentials.Add(new DemoCredential(name, role, password));
        }
        return credentials;
    }
}
