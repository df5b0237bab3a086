using System.Diagnostics;

namespace RunWatch.Testing.Documents;

/// <summary>Runs Debian poppler-utils (pdftotext, pdfinfo, pdftoppm) on a file, a real PDF reader outside the project.</summary>
public static class PopplerText
{
    public static string Run(string tool, params string[] args)
    {
        var psi = new ProcessStartInfo(tool) { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        foreach (string a in args)
        {
            psi.ArgumentList.Add(a);
        }
        using Process process = Process.Start(psi) ?? throw new InvalidOperationException($"could not start {tool}");
        Task<string> stdout = process.StandardOutput.ReadToEndAsync();
        Task<string> stderr = process.StandardError.ReadToEndAsync();
        if (!process.WaitForExit(TimeSpan.FromMinutes(1)))
        {
            process.Kill(entireProcessTree: true);
            throw new TimeoutException($"{tool} did not finish in a minute");
        }
        if (process.ExitCode != 0)
        {
            throw new InvalidOperationException($"{tool} exited {process.ExitCode}: {stderr.GetAwaiter().GetResult()}");
        }
        return stdout.GetAwaiter().GetResult();
    }

    /// <summary>Text of the PDF with runs of whitespace folded to one space (wrapped lines join up).</summary>
    public static string Text(string pdfPath) =>
        string.Join(' ', Run("pdftotext", "-enc", "UTF-8", pdfPath, "-").Split((char[])[' ', '\n', '\r', '\t', '\f'], StringSplitOptions.RemoveEmptyEntries));
}
