using System.Diagnostics;
using System.Text;
using System.Text.Json;
using RunWatch.Testing.Documents;
using RunWatch.Testing.Mqtt;
using Xunit;

namespace RunWatch.Tests.Demo;

/// <summary>
/// The whole job headless, as a newcomer runs it: <c>runwatch demo</c> in its own process with the embedded broker
/// and SQLite (shared with the browser tests through <see cref="DemoFixture"/>). Invented telemetry and events go in
/// over MQTT, invented SEM fields are dropped after each run, and every demo wafer must come out with report files
/// and a verdict; the PDF is read back with pdftotext (poppler-utils, an independent reader).
/// </summary>
[Collection(DemoCollection.Name)]
public sealed class DemoEndToEndTests(DemoFixture demo) : IDisposable
{
    private readonly string _folder = Path.Combine(Path.GetTempPath(), "rw-demo-" + Guid.NewGuid().ToString("N"));

    public void Dispose()
    {
        if (Directory.Exists(_folder))
        {
            Directory.Delete(_folder, recursive: true);
        }
    }

    [Fact]
    public async Task Demo_FreshFolder_EveryWaferGetsReportWithVerdict()
    {
        await demo.WaitAllReportedAsync();
        string output = demo.Output;

        Assert.False(demo.HasExited, "the demo should keep running after its last report:\n" + output);
        Assert.Contains("invented", output, StringComparison.Ordinal);
        foreach (string wafer in new[] { "W-DEMO-01-A", "W-DEMO-01-B", "W-DEMO-02-A" })
        {
            (string folder, string stem) = NewestRevision(wafer);
            string pdf = Path.Combine(folder, stem + ".pdf");
            Assert.True(File.Exists(pdf), $"no PDF for {wafer}:\n{output}");
            Assert.True(File.Exists(Path.Combine(folder, stem + ".html")));
            Assert.True(File.Exists(Path.Combine(folder, stem + "-wires.csv")));
            using var summary = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder, stem + ".json")));
            string verdict = summary.RootElement.GetProperty("verdict").GetProperty("outcome").GetString()!;
            Assert.Contains(verdict, new[] { "Pass", "Warn", "Fail" });
            // The demo prints each wafer's first verdict. A browser test of the same demo may upload a field to a demo
            // wafer (DemoFieldScreensBrowserTests), which rightly rewrites its report; then only the printed line is checked.
            bool onlyDemoFields = File.ReadLines(Path.Combine(folder, stem + "-wires.csv")).Skip(1)
                .All(line => line.Contains("_field0", StringComparison.Ordinal));
            Assert.Matches($"wafer {wafer}: verdict (PASS|WARN|FAIL)", output);
            if (onlyDemoFields)
            {
                Assert.Contains($"wafer {wafer}: verdict {verdict.ToUpperInvariant()}", output, StringComparison.Ordinal);
            }

            string text = PopplerText.Text(pdf);
            Assert.Contains(wafer, text, StringComparison.Ordinal);
            Assert.Contains(verdict.ToUpperInvariant(), text.ToUpperInvariant(), StringComparison.Ordinal);
        }
        // The first wafer proposes the process's radius model, the demo user accepts it, and the later wafer is
        // judged against it: its bias rule is measured, not skipped.
        Assert.Contains("accepted by 'demo-engineer'", output, StringComparison.Ordinal);
        (string laterFolder, string laterStem) = NewestRevision("W-DEMO-02-A");
        using var later = JsonDocument.Parse(File.ReadAllText(Path.Combine(laterFolder, laterStem + ".json")));
        JsonElement bias = later.RootElement.GetProperty("verdict").GetProperty("rules").EnumerateArray()
            .Single(r => r.GetProperty("rule").GetString() == "prediction-bias");
        Assert.Equal(JsonValueKind.Number, bias.GetProperty("measured").ValueKind);
        Assert.DoesNotContain("Unhandled exception", output, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Verify_DemoReportRevision_VerifiesAndACopyWithOneByteChangedDoesNot()
    {
        await demo.WaitAllReportedAsync();
        (string folder, string stem) = NewestRevision("W-DEMO-01-A");

        var (okCode, okOutput) = Run(TimeSpan.FromMinutes(1), "verify", Path.Combine(folder, stem + ".pdf"), "--Storage:DataDirectory=" + demo.DataFolder);

        Assert.True(okCode == 0, okOutput);
        Assert.Contains("verified: wafer W-DEMO-01-A revision", okOutput, StringComparison.Ordinal);

        // A copy of the revision with one byte of its PDF changed (the copy is writable; the issued files are not).
        Directory.CreateDirectory(_folder);
        foreach (string file in Directory.EnumerateFiles(folder))
        {
            File.WriteAllBytes(Path.Combine(_folder, Path.GetFileName(file)), File.ReadAllBytes(file));
        }
        string copy = Path.Combine(_folder, stem + ".pdf");
        byte[] bytes = File.ReadAllBytes(copy);
        bytes[bytes.Length / 2] ^= 0x20;
        File.WriteAllBytes(copy, bytes);

        var (badCode, badOutput) = Run(TimeSpan.FromMinutes(1), "verify", _folder, "--no-store");

        Assert.Equal(1, badCode);
        Assert.Contains("MISMATCH", badOutput, StringComparison.Ordinal);
        Assert.Contains(stem + ".pdf has changed since it was issued", badOutput, StringComparison.Ordinal);
    }

    /// <summary>The newest revision folder of a demo wafer's report and its files' common name.</summary>
    private (string Folder, string Stem) NewestRevision(string wafer)
    {
        string root = Path.Combine(demo.DataFolder, "reports", wafer);
        int newest = Directory.Exists(root)
            ? Directory.EnumerateDirectories(root, "r*").Select(d => int.TryParse(Path.GetFileName(d)[1..], out int n) ? n : 0).DefaultIfEmpty(0).Max()
            : 0;
        Assert.True(newest > 0, "no report revision for " + wafer + " under " + root);
        return (Path.Combine(root, "r" + newest.ToString(System.Globalization.CultureInfo.InvariantCulture)), wafer + "-r" + newest.ToString(System.Globalization.CultureInfo.InvariantCulture));
    }

    [Fact]
    public void Demo_FolderThatIsNotADemoFolder_RefusedAndLeftAlone()
    {
        Directory.CreateDirectory(_folder);
        string precious = Path.Combine(_folder, "notes.txt");
        File.WriteAllText(precious, "not demo data");

        var (exitCode, output) = Run(TimeSpan.FromMinutes(1), "demo", "--data-folder", _folder, "--exit-when-done");

        Assert.Equal(2, exitCode);
        Assert.Contains("not a RunWatch demo folder", output, StringComparison.Ordinal);
        Assert.Equal("not demo data", File.ReadAllText(precious));
    }

    [Theory]
    [InlineData("TERM")]
    [InlineData("INT")]
    public async Task Demo_SignalWhilePlaying_StopsCleanly(string signal)
    {
        // A test runner started in the background by a non-interactive shell inherits SIGINT as ignored, and .NET
        // keeps an inherited SIG_IGN; a terminal's Ctrl+C reaches a demo with the default disposition, so the child
        // is started with it restored (Python's signal module, then exec into dotnet under the same pid).
        var psi = new ProcessStartInfo("/usr/bin/python3") { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        foreach (string a in new[]
        {
            "-c", "import os, signal, sys; signal.signal(signal.SIGINT, signal.SIG_DFL); os.execvp(sys.argv[1], sys.argv[1:])", "dotnet",
            Path.Combine(AppContext.BaseDirectory, "runwatch.dll"), "demo", "--data-folder", _folder,
            $"--Broker:Port={FreePort.Next()}", $"--Urls=http://127.0.0.1:{FreePort.Next()}",
        })
        {
            psi.ArgumentList.Add(a);
        }
        var output = new StringBuilder();
        using var process = StartCapturing(psi, output);
        string Text() { lock (output) { return output.ToString(); } }
        var deadline = DateTime.UtcNow.AddMinutes(1);
        while (!Text().Contains("[demo] run R-DEMO-01", StringComparison.Ordinal) && !process.HasExited && DateTime.UtcNow < deadline)
        {
            await Task.Delay(100);
        }
        Assert.False(process.HasExited, "the demo ended before playing:\n" + Text());

        // kill(1) as a service manager or a terminal sends it; the demo must stop as it does on Ctrl+C.
        using (var kill = Process.Start("kill", ["-" + signal, process.Id.ToString(System.Globalization.CultureInfo.InvariantCulture)]))
        {
            await kill.WaitForExitAsync();
        }
        using var bound = new CancellationTokenSource(TimeSpan.FromSeconds(30));
        try
        {
            await process.WaitForExitAsync(bound.Token);
        }
        catch (OperationCanceledException)
        {
            process.Kill(entireProcessTree: true);
            Assert.Fail($"SIG{signal} did not stop the demo within 30 s:\n" + Text());
        }
        process.WaitForExit();
        Assert.True(Text().Contains("[demo] stopped.", StringComparison.Ordinal), $"SIG{signal} while playing did not end in '[demo] stopped.' (exit {process.ExitCode}):\n" + Text());
    }

    /// <summary>Starts the process with standard output and error both appended to <paramref name="output"/> (lock it to read).</summary>
    private static Process StartCapturing(ProcessStartInfo psi, StringBuilder output)
    {
        var process = new Process { StartInfo = psi };
        process.OutputDataReceived += (_, e) => { lock (output) { output.AppendLine(e.Data); } };
        process.ErrorDataReceived += (_, e) => { lock (output) { output.AppendLine(e.Data); } };
        process.Start();
        process.BeginOutputReadLine();
        process.BeginErrorReadLine();
        return process;
    }

    private static (int ExitCode, string Output) Run(TimeSpan timeout, params string[] args)
    {
        var psi = new ProcessStartInfo("dotnet") { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        psi.ArgumentList.Add(Path.Combine(AppContext.BaseDirectory, "runwatch.dll"));
        foreach (string a in args)
        {
            psi.ArgumentList.Add(a);
        }
        var output = new StringBuilder();
        using var process = StartCapturing(psi, output);
        if (!process.WaitForExit(timeout))
        {
            process.Kill(entireProcessTree: true);
            process.WaitForExit();
            lock (output)
            {
                return (-1, "timed out after " + timeout + "\n" + output);
            }
        }
        process.WaitForExit();
        lock (output)
        {
            return (process.ExitCode, output.ToString());
        }
    }
}
