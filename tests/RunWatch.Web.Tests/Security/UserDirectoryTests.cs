using Microsoft.AspNetCore.Identity;
using RunWatch.Web.Security;
using Xunit;

namespace RunWatch.Web.Tests.Security;

public sealed class UserDirectoryTests
{
    [Fact]
    public void Verify_RightAndWrongPassword_AcceptsOnlyTheRightOne()
    {
        var users = new UserDirectory();
        users.AddWithPassword("tech", DashboardRoles.Viewer, "s3cret-enough");
        Assert.Equal("tech", users.Verify("tech", "s3cret-enough")?.Name);
        Assert.Null(users.Verify("tech", "S3cret-enough"));
        Assert.Null(users.Verify("nobody", "s3cret-enough"));
    }

    [Fact]
    public void HashPassword_IsFrameworkV3FormatAndNeverThePassword()
    {
        var users = new UserDirectory();
        string hash = users.HashPassword("s3cret-enough");
        Assert.DoesNotContain("s3cret", hash, StringComparison.Ordinal);
        // COMMON PRACTICE: Identity's v3 hashes are base64 starting with format marker 0x01.
        Assert.Equal(0x01, Convert.FromBase64String(hash)[0]);
    }

    [Fact]
    public void Verify_MalformedHashInConfiguration_RefusesInsteadOfThrowing()
    {
        var users = new UserDirectory();
        users.Add(new DashboardUser("broken", DashboardRoles.Admin, "not-base64!"));
        Assert.Null(users.Verify("broken", "anything"));
    }

    [Fact]
    public void Add_UnknownRole_ThrowsWithRoleNames()
    {
        var ex = Assert.Throws<ArgumentException>(() => new UserDirectory().Add(new DashboardUser("x", "root", "h")));
        Assert.Contains("viewer, engineer or admin", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void CreateDemoUsers_OnePerRoleWithDistinctWorkingPasswords()
    {
        var users = new UserDirectory();
        var demo = users.CreateDemoUsers();
        Assert.Equal(DashboardRoles.All, demo.Select(d => d.Role));
        Assert.Equal(3, demo.Select(d => d.Password).Distinct().Count());
        Assert.All(demo, d => Assert.Equal(d.Role, users.Verify(d.Name, d.Password)?.Role));
    }

    [Theory]
    [InlineData("nobody", "s3cret-enough")]
    [InlineData("", "s3cret-enough")]
    [InlineData("tech", "")]
    [InlineData("nobody", "")]
    public void Verify_UnknownNameOrEmptyInput_DoesTheSameHashWorkAsAKnownName(string name, string password)
    {
        var hasher = new RecordingHasher();
        var users = new UserDirectory(hasher);
        users.AddWithPassword("tech", DashboardRoles.Viewer, "s3cret-enough");
        hasher.Verified.Clear();
        Assert.NotNull(users.Verify("tech", "s3cret-enough"));
        string knownHash = Assert.Single(hasher.Verified);
        hasher.Verified.Clear();

        Assert.Null(users.Verify(name, password));

        // One PBKDF2 verification, against a hash with the same header (format, PRF, iteration count, salt length:
        // the first 13 bytes of Identity's v3 format, COMMON PRACTICE), so the work done is the same.
        string standIn = Assert.Single(hasher.Verified);
        Assert.Equal(Convert.FromBase64String(knownHash)[..13], Convert.FromBase64String(standIn)[..13]);
    }

    private sealed class RecordingHasher : IPasswordHasher<DashboardUser>
    {
        private readonly PasswordHasher<DashboardUser> _inner = new();

        public List<string> Verified { get; } = [];

        public string HashPassword(DashboardUser user, string password) => _inner.HashPassword(user, password);

        public PasswordVerificationResult VerifyHashedPassword(DashboardUser user, string hashedPassword, string providedPassword)
        {
            Verified.Add(hashedPassword);
            return _inner.VerifyHashedPassword(user, hashedPassword, providedPassword);
        }
    }
}
