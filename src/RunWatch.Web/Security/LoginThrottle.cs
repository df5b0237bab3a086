using System.Threading.RateLimiting;
using Microsoft.Extensions.Options;

namespace RunWatch.Web.Security;

/// <summary>
/// Login attempts per user name, whatever the client address (the per-address limit is the ASP.NET Core rate
/// limiter policy <see cref="AddressPolicy"/> on the login endpoint). Every name is limited, known or not, so a 429
/// does not tell which names exist. Thread-safe; idle partitions are dropped by the limiter.
/// </summary>
internal sealed class LoginThrottle : IDisposable
{
    /// <summary>Name of the per-address rate limiter policy.</summary>
    public const string AddressPolicy = "login-per-address";

    private readonly PartitionedRateLimiter<string> _perUser;

    public LoginThrottle(IOptions<DashboardOptions> options)
    {
        var o = options.Value;
        _perUser = PartitionedRateLimiter.Create<string, string>(name => RateLimitPartition.GetFixedWindowLimiter(name, _ => new FixedWindowRateLimiterOptions
        {
            PermitLimit = o.LoginAttemptsPerUser,
            Window = o.LoginWindow,
            QueueLimit = 0,
        }));
    }

    /// <summary>Takes one attempt for <paramref name="userName"/>; false when its limit for the window is used up.</summary>
    public bool TryAttempt(string? userName)
    {
        using var lease = _perUser.AttemptAcquire((userName ?? "").Trim().ToUpperInvariant());
        return lease.IsAcquired;
    }

    public void Dispose() => _perUser.Dispose();
}
