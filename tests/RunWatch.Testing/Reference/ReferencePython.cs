using System.Diagnostics;

namespace RunWatch.Testing.Reference;

/// <summary>
/// Runs a reference script from tests/reference with Debian's Python, which sees python3-scipy, python3-skimage,
/// python3-shapely and python3-opencv. The interpreter is <c>RUNWATCH_REFERENCE_PYTHON</c>, else /usr/bin/python3
/// (the python3 first on PATH on these machines is another build that cannot import them).
/// </summary>
public static class ReferencePython
{
    public static string Interpreter =>
        Environment.GetEnvironmentVariable("RUNWATCH_REFERENCE_PYTHON") is { Length: > 0 } p ? p : "/usr/bin/python3";

    /// <summary>Folder tests/reference of the repository, found by walking up from the test binaries.</summary>
    public static string ScriptsFolder => Path.Combine(RepositoryRoot.Path, "tests", "reference");

    /// <summary>Runs <paramref name="script"/> (a file name in tests/reference) and returns its standard output. Throws with stderr on failure.</summary>
    public static string Run(string script, params string[] args)
    {
        var psi = new ProcessStartInfo(Interpreter)
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        psi.ArgumentList.Add(Path.Combine(ScriptsFolder, script));
        foreach (var a in args)
        {
            psi.ArgumentList.Add(a);
        }
        using var process = Process.Start(psi) ?? throw new InvalidOperationException($"could not start {Interpreter}");
        var stdoutTask = process.StandardOutput.ReadToEndAsync();
        var stderrTask = process.StandardError.ReadToEndAsync();
        if (!process.WaitForExit(TimeSpan.FromMinutes(5)))
        {
            process.Kill(entireProcessTree: true);
            throw new TimeoutException($"{script} did not finish in 5 minutes");
        }
        string stdout = stdoutTask.GetAwaiter().GetResult();
        string stderr = stderrTask.GetAwaiter().GetResult();
        if (process.ExitCode != 0)
        {
            throw new InvalidOperationException($"{script} exited {process.ExitCode}: {stderr}");
        }
        return stdout;
    }
}
