using System.Diagnostics;
using RunWatch.Wafers.Intake;
using Xunit;

namespace RunWatch.Wafers.Tests.Intake;

/// <summary>What a careless or hostile file in the drop folder does: each is refused once and reported, nothing blocks.</summary>
public sealed class DropFolderRefusalTests : IDisposable
{
    private static readonly DateTimeOffset T0 = new(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);
    private readonly string _root = Directory.CreateTempSubdirectory("rw-drop-refuse-").FullName;
    private readonly string _outside = Directory.CreateTempSubdirectory("rw-outside-").FullName;

    public void Dispose()
    {
        Directory.Delete(_root, recursive: true);
        Directory.Delete(_outside, recursive: true);
    }

    [Fact]
    public void Scan_SymbolicLinks_RefusedAndNeverFollowed()
    {
        File.WriteAllBytes(Path.Combine(_outside, "real.png"), [1, 2, 3]);
        File.CreateSymbolicLink(Path.Combine(_root, "W-1_f1.png"), "/dev/zero");
        File.CreateSymbolicLink(Path.Combine(_root, "W-1_f2.png"), Path.Combine(_outside, "real.png"));
        Directory.CreateSymbolicLink(Path.Combine(_root, "linked-folder"), _outside);

        var (arrived, refused) = ScanThrice();

        Assert.Empty(arrived);
        Assert.Equal(["W-1_f1.png", "W-1_f2.png", "linked-folder"], refused.Select(r => r.RelativePath).Order(StringComparer.Ordinal));
        Assert.All(refused, r => Assert.Contains("symbolic link", r.Reason, StringComparison.Ordinal));
    }

    [Fact]
    public void Scan_ZeroByteFile_RefusedOnceStableNotWatchedForEver()
    {
        File.WriteAllBytes(Path.Combine(_root, "W-1_f1.png"), []);

        var (arrived, refused) = ScanThrice();

        Assert.Empty(arrived);
        var refusal = Assert.Single(refused);
        Assert.Equal("W-1_f1.png", refusal.RelativePath);
        Assert.Contains("zero bytes", refusal.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void Scan_FifoNamedPng_RefusedWithoutOpeningIt()
    {
        string fifo = Path.Combine(_root, "W-1_f1.png");
        using (var mkfifo = Process.Start("/usr/bin/mkfifo", [fifo]))
        {
            mkfifo.WaitForExit();
            Assert.Equal(0, mkfifo.ExitCode);
        }

        // Opening a FIFO for reading would block this test for ever: returning at all shows it was not opened.
        var (arrived, refused) = ScanThrice();

        Assert.Empty(arrived);
        Assert.Contains("not a regular file", Assert.Single(refused).Reason, StringComparison.Ordinal);
    }

    private (List<ArrivedField> Arrived, List<RefusedFile> Refused) ScanThrice()
    {
        var scanner = new DropFolderScanner(_root, TimeSpan.FromSeconds(1));
        var arrived = new List<ArrivedField>();
        var refused = new List<RefusedFile>();
        scanner.Scan(T0, arrived, refused);
        scanner.Scan(T0.AddSeconds(2), arrived, refused);
        scanner.Scan(T0.AddSeconds(4), arrived, refused);
        return (arrived, refused);
    }
}
