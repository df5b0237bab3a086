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
}
