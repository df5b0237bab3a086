using RunWatch.Imaging.Analysis;
using RunWatch.Imaging.Scale;
using Xunit;

namespace RunWatch.Imaging.Tests.Scale;

/// <summary>Sidecars and options outside physical ranges, and sidecars that are not small regular files.</summary>
public sealed class FieldSidecarBoundsTests : IDisposable
{
    private readonly string _folder = Directory.CreateTempSubdirectory("rw-sidecar-").FullName;

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    [Theory]
    [InlineData("1e-300", "pixelSizeNm")]
    [InlineData("1e308", "pixelSizeNm")]
    [InlineData("0.0001", "pixelSizeNm")]
    [InlineData("-2", "pixelSizeNm")]
    public void TryLoadFor_PixelSizeOutsidePhysicalRange_ErrorNamesFileAndField(string value, string field)
    {
        string image = Image("""{"format":"runwatch-field/1","pixelSizeNm":VALUE}""".Replace("VALUE", value, StringComparison.Ordinal));

        var error = Assert.Throws<FieldSidecarException>(() => FieldSidecar.TryLoadFor(image));

        Assert.Contains("f1.png.field.json", error.Message, StringComparison.Ordinal);
        Assert.Contains(field + " must lie between 0.001 and 100000 nm", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void TryLoadFor_PositionBeyondAnyStage_ErrorNamesField()
    {
        string image = Image("""{"format":"runwatch-field/1","fieldPosition":{"xMm":1e300,"yMm":0}}""");
        var error = Assert.Throws<FieldSidecarException>(() => FieldSidecar.TryLoadFor(image));
        Assert.Contains("fieldPosition.xMm", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void TryLoadFor_SidecarLinkedToDevZero_RefusedWithoutReading()
    {
        string image = Path.Combine(_folder, "f1.png");
        File.CreateSymbolicLink(FieldSidecar.PathFor(image), "/dev/zero");
        var error = Assert.Throws<FieldSidecarException>(() => FieldSidecar.TryLoadFor(image));
        Assert.Contains("symbolic link", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void TryLoadFor_SidecarOverTheSizeLimit_Refused()
    {
        string image = Image("""{"format":"runwatch-field/1","waferId":"W-1"}""" + new string(' ', FieldSidecar.MaxBytes));
        var error = Assert.Throws<FieldSidecarException>(() => FieldSidecar.TryLoadFor(image));
        Assert.Contains("larger than", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void TryLoadFor_DanglingLink_RefusedNotIgnored()
    {
        string image = Path.Combine(_folder, "f1.png");
        File.CreateSymbolicLink(FieldSidecar.PathFor(image), Path.Combine(_folder, "missing"));
        Assert.Throws<FieldSidecarException>(() => FieldSidecar.TryLoadFor(image));
    }

    [Theory]
    [InlineData(1e-300)]
    [InlineData(1e308)]
    public void Validate_PixelSizeOptionOutsideRange_ThrowsNamingTheOption(double value)
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => new FieldAnalysisOptions { PixelSizeNm = value }.Validate());
        Assert.Equal(nameof(FieldAnalysisOptions.PixelSizeNm), error.ParamName);
    }

    private string Image(string sidecar)
    {
        string image = Path.Combine(_folder, "f1.png");
        File.WriteAllText(FieldSidecar.PathFor(image), sidecar);
        return image;
    }
}
