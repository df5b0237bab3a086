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
    private readonly IPasswordHasher<DashboardUser> _hasher;

    // Checked against when the name is unknown, so that a known and an unknown name cost the same PBKDF2 work and
    // cannot be told apart by timing.
    private readonly DashboardUser _standIn;

    /// <summary>A directory with ASP.NET Core Identity's default password hasher.</summary>
    public UserDirectory()
        : this(new PasswordHasher<DashboardUser>())
    {
    }

    internal UserDirectory(IPasswordHasher<DashboardUser> hasher)
    {
        _hasher = hasher;
        var nobody = new DashboardUser("", DashboardRoles.Viewer, "");
        _standIn = nobody with { PasswordHash = hasher.HashPassword(nobody, RandomNumberGenerator.GetHexString(32)) };
    }

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

    /// <summary>
    /// Returns the user if the name is known and the password matches; otherwise null. Does one hash verification
    /// whatever the outcome (an unknown name is checked against a stand-in hash), so the time taken does not tell
    /// whether the name exists.
    /// </summary>
    public DashboardUser? Verify(string name, string password)
    {
        DashboardUser? found = null;
        bool known = !string.IsNullOrEmpty(name) && _users.TryGetValue(name, out found);
        var user = known ? found! : _standIn;
        try
        {
            bool matches = _hasher.VerifyHashedPassword(user, user.PasswordHash, password ?? "") != PasswordVerificationResult.Failed;
            return known && matches && !string.IsNullOrEmpty(password) ? user : null;
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
