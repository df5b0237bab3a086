using RunWatch.Wafers.Pipeline;
using Xunit;

namespace RunWatch.Wafers.Tests.Pipeline;

/// <summary>Report folders are keyed so that distinct wafer ids never share one.</summary>
public sealed class ReportFolderKeyTests
{
    [Theory]
    [InlineData(".COL", "_COL")]
    [InlineData(".COL", "COL")]
    [InlineData("_COL", "COL")]
    [InlineData("W 1", "W_1")]
    [InlineData("../x", "x")]
    [InlineData("", "_")]
    public void SafeFolderName_DistinctIds_DistinctFolders(string a, string b)
    {
        Assert.NotEqual(WaferReportService.SafeFolderName(a), WaferReportService.SafeFolderName(b));
    }

    [Theory]
    [InlineData("W-0412-A")]
    [InlineData("W.1")]
    public void SafeFolderName_PlainId_KeepsItsName(string id)
    {
        Assert.Equal(id, WaferReportService.SafeFolderName(id));
    }

    [Fact]
    public void SafeFolderName_HostileId_StaysOneFolderLevel()
    {
        string name = WaferReportService.SafeFolderName("../../etc/passwd");
        Assert.DoesNotContain('/', name);
        Assert.DoesNotContain("..", name, StringComparison.Ordinal);
    }
}
