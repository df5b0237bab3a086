using RunWatch.Wafers.Intake;
using Xunit;

namespace RunWatch.Wafers.Tests.Intake;

public sealed class WaferIdResolverTests
{
    private readonly WaferIdResolver _resolver = new(WaferIdResolver.DefaultPattern);

    [Theory]
    [InlineData("W-0412-A_field01.tif", "W-0412-A")]
    [InlineData("sem_W-0413-B_03.png", "W-0413-B")]
    [InlineData("W-7.png", "W-7")]
    public void Resolve_NameWithId_FindsWafer(string name, string expected) => Assert.Equal(expected, _resolver.Resolve(name, null));

    [Theory]
    [InlineData("field01.tif")]
    [InlineData("wafer.png")]
    public void Resolve_NameWithoutId_Unassigned(string name) => Assert.Null(_resolver.Resolve(name, null));

    [Fact]
    public void Resolve_SidecarId_WinsOverName() => Assert.Equal("W-0500-C", _resolver.Resolve("W-0412-A_f1.png", "W-0500-C"));

    [Fact]
    public void Resolve_SidecarIdWithMarkup_TreatedAsNoId() => Assert.Null(_resolver.Resolve("f1.png", "<script>alert(1)</script>"));

    [Fact]
    public void Constructor_PatternWithoutWaferGroup_Throws() =>
        Assert.Throws<ArgumentException>(() => new WaferIdResolver("W-[0-9]+"));

    [Fact]
    public void Resolve_CustomPattern_UsesNamedGroup()
    {
        var resolver = new WaferIdResolver(@"^lot(?<wafer>[0-9]{4})_");
        Assert.Equal("0042", resolver.Resolve("lot0042_field3.tif", null));
    }
}
