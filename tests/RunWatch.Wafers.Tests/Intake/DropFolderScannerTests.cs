using RunWatch.Wafers.Intake;
using Xunit;

namespace RunWatch.Wafers.Tests.Intake;

public sealed class DropFolderScannerTests : IDisposable
{
    private static readonly DateTimeOffset T0 = new(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);
    private readonly string _root = Directory.CreateTempSubdirectory("rw-drop-").FullName;

    public void Dispose() => Directory.Delete(_root, recursive: true);

    [Fact]
    public void Scan_StableImage_ArrivesOnceAndIsNotChanged()
    {
        string path = Path.Combine(_root, "W-0412-A_f1.png");
        File.WriteAllBytes(path, [1, 2, 3]);
        var scanner = new DropFolderScanner(_root, TimeSpan.FromSeconds(1));
        var arrived = new List<ArrivedField>();
        var refused = new List<RefusedFile>();

        scanner.Scan(T0, arrived, refused);
        Assert.Empty(arrived);
        scanner.Scan(T0.AddSeconds(2), arrived, refused);
        scanner.Scan(T0.AddSeconds(4), arrived, refused);

        var field = Assert.Single(arrived);
        Assert.Equal("W-0412-A_f1.png", field.RelativePath);
        Assert.Equal(3, field.SizeBytes);
        Assert.Equal(new byte[] { 1, 2, 3 }, File.ReadAllBytes(path));
        Assert.Empty(refused);
    }

    [Fact]
    public void Scan_OddNamesAndSidecars_RefusedOnceOrIgnored()
    {
        File.WriteAllText(Path.Combine(_root, "notes.txt"), "x");
        File.WriteAllText(Path.Combine(_root, "W-1_f1.json"), "{}");
        File.WriteAllText(Path.Combine(_root, ".partial.png"), "x");
        var scanner = new DropFolderScanner(_root, TimeSpan.FromSeconds(1));
        var arrived = new List<ArrivedField>();
        var refused = new List<RefusedFile>();

        scanner.Scan(T0, arrived, refused);
        scanner.Scan(T0.AddSeconds(5), arrived, refused);

        Assert.Empty(arrived);
        Assert.Equal(2, refused.Count);
        Assert.Contains(refused, r => r.RelativePath == "notes.txt" && r.Reason.Contains("not an image", StringComparison.Ordinal));
        Assert.Contains(refused, r => r.RelativePath == ".partial.png" && r.Reason == "hidden file");
    }

    [Fact]
    public void Scan_UploadBeingWritten_NeitherArrivesNorRefused()
    {
        // The uploader's hidden partial file in uploads/ is its own business; a hidden file anywhere else is still refused.
        Directory.CreateDirectory(Path.Combine(_root, "uploads"));
        File.WriteAllBytes(Path.Combine(_root, "uploads", ".0123456789abcdef0123456789abcdef.partial"), [1, 2, 3]);
        File.WriteAllBytes(Path.Combine(_root, ".0123456789abcdef0123456789abcdef.partial"), [1, 2, 3]);
        var scanner = new DropFolderScanner(_root, TimeSpan.FromSeconds(1));
        var arrived = new List<ArrivedField>();
        var refused = new List<RefusedFile>();

        scanner.Scan(T0, arrived, refused);
        scanner.Scan(T0.AddSeconds(5), arrived, refused);

        Assert.Empty(arrived);
        var only = Assert.Single(refused);
        Assert.Equal((".0123456789abcdef0123456789abcdef.partial", "hidden file"), (only.RelativePath, only.Reason));
    }

    [Fact]
    public void Scan_MissingFolder_FindsNothing()
    {
        var scanner = new DropFolderScanner(Path.Combine(_root, "absent"), TimeSpan.FromSeconds(1));
        var arrived = new List<ArrivedField>();
        scanner.Scan(T0, arrived, []);
        Assert.Empty(arrived);
    }
}
