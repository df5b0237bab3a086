using System.Diagnostics;

namespace RunWatch.Testing.Mqtt;

/// <summary>A throw-away CA and a broker certificate for 127.0.0.1, made with the openssl command line (an independent tool).</summary>
public static class TestCertificates
{
    /// <summary>Writes ca.crt, broker.crt and broker.key into <paramref name="folder"/>.</summary>
    public static void Create(string folder)
    {
        Run(folder, "req", "-x509", "-newkey", "rsa:2048", "-nodes", "-days", "2", "-subj", "/CN=RunWatch test CA", "-keyout", "ca.key", "-out", "ca.crt");
        Run(folder, "req", "-newkey", "rsa:2048", "-nodes", "-subj", "/CN=127.0.0.1", "-keyout", "broker.key", "-out", "broker.csr");
        File.WriteAllText(Path.Combine(folder, "san.ext"), "subjectAltName=IP:127.0.0.1,DNS:localhost\n");
        Run(folder, "x509", "-req", "-in", "broker.csr", "-CA", "ca.crt", "-CAkey", "ca.key", "-CAcreateserial", "-days", "2", "-extfile", "san.ext", "-out", "broker.crt");
    }

    private static void Run(string folder, params string[] args)
    {
        var psi = new ProcessStartInfo("openssl") { WorkingDirectory = folder, RedirectStandardError = true, RedirectStandardOutput = true, UseShellExecute = false };
        foreach (string a in args)
        {
            psi.ArgumentList.Add(a);
        }
        using var process = Process.Start(psi)!;
        string error = process.StandardError.ReadToEnd();
        process.WaitForExit();
        if (process.ExitCode != 0)
        {
            throw new InvalidOperationException("openssl " + args[0] + " failed: " + error);
        }
    }
}
