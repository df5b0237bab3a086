using RunWatch.Wafers.Intake;
using Xunit;

namespace RunWatch.Wafers.Tests.Intake;

public sealed class FieldFileNameCheckTests
{
    [Theory]
    [InlineData("W-0412-A_field01.tif")]
    [InlineData("2026-03-04/W-0412-A_f2.png")]
    [InlineData("field without id.jpeg")]
    public void Refusal_OrdinaryImageNames_Accepted(string name) => Assert.Null(FieldFileNameCheck.Refusal(name));

    [Theory]
    [InlineData("../etc/passwd.png", "path leaves")]
    [InlineData("a/../../b.png", "path leaves")]
    [InlineData("/abs/field.png", "absolute path")]
    [InlineData(".hidden.png", "hidden file")]
    [InlineData("-rf.png", "starts with '-'")]
    [InlineData("bad\u0007bell.png", "control character")]
    [InlineData("new\nline.png", "control character")]
    [InlineData("notes.txt", "not an image")]
    [InlineData("field.png ", "ends with a space")]
    [InlineData("", "empty file name")]
    public void Refusal_MaliciousOrOddNames_RefusedWithReason(string name, string reasonPart)
    {
        string? reason = FieldFileNameCheck.Refusal(name);
        Assert.NotNull(reason);
        Assert.Contains(reasonPart, reason, StringComparison.Ordinal);
    }

    [Fact]
    public void Refusal_OverlongName_Refused()
    {
        string name = new string('a', FieldFileNameCheck.MaxNameLength + 1) + ".png";
        Assert.Contains("longer than", FieldFileNameCheck.Refusal(name), StringComparison.Ordinal);
    }

    [Fact]
    public void ResolveInside_EscapingPath_ReturnsNull()
    {
        string root = Path.Combine(Path.GetTempPath(), "rw-drop");
        Assert.Null(FieldFileNameCheck.ResolveInside(root, "../outside.png"));
        Assert.Null(FieldFileNameCheck.ResolveInside(root, "sub/../../outside.png"));
        Assert.Equal(Path.Combine(Path.GetFullPath(root), "sub", "f.png"), FieldFileNameCheck.ResolveInside(root, "sub/f.png"));
    }
}
