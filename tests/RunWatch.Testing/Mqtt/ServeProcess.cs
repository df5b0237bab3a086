using System.Diagnostics;
using System.Globalization;
using System.Net.Http;
using System.Text;
using System.Text.Json;

namespace RunWatch.Testing.Mqtt;

/// <summary>
/// A real <c>runwatch serve</c> child process (<c>dotnet src/RunWatch/bin/{configuration}/net10.0/runwatch.dll serve …</c>)
/// against an external broker, with its data folder as working directory. <see cref="Kill"/> sends SIGKILL.
/// </summary>
public sealed class ServeProcess : IAsyncDisposable
{
    private readonly Process _process;
    private readonly StringBuilder _output = new();
    private static readonly HttpClient Http = new() { Timeout = TimeSpan.FromSeconds(5) };

    private ServeProcess(Process process, int httpPort)
    {
        _process = process;
        HttpPort = httpPort;
        process.OutputDataReceived += (_, e) => Append(e.Data);
        process.ErrorDataReceived += (_, e) => Append(e.Data);
        process.BeginOutputReadLine();
        process.BeginErrorReadLine();
    }

    public int HttpPort { get; }

    public int ProcessId => _process.Id;

    public string Output
    {
        get
        {
            lock (_output)
            {
                return _output.ToString();
            }
        }
    }

    /// <summary>runwatch.dll built next to these tests (same configuration).</summary>
    public static string DllPath
    {
        get
        {
            string configuration = AppContext.BaseDirectory.Contains("/bin/Release/", StringComparison.Ordinal) ? "Release" : "Debug";
            string path = Path.Combine(RepositoryRoot.Path, "src", "RunWatch", "bin", configuration, "net10.0", "runwatch.dll");
            return File.Exists(path) ? path : throw new FileNotFoundException("build src/RunWatch first (" + configuration + ")", path);
        }
    }

    /// <summary>Starts the daemon with <paramref name="settings"/> as <c>--Key=value</c> arguments.</summary>
    public static ServeProcess Start(string workingDirectory, IReadOnlyDictionary<string, string> settings)
    {
        int httpPort = FreePort.Next();
        var psi = new ProcessStartInfo("dotnet")
        {
            WorkingDirectory = workingDirectory,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        psi.ArgumentList.Add(DllPath);
        psi.ArgumentList.Add("serve");
        psi.ArgumentList.Add("--Urls=http://127.0.0.1:" + httpPort.ToString(CultureInfo.InvariantCulture));
        foreach (var (key, value) in settings)
        {
            psi.ArgumentList.Add("--" + key + "=" + value);
        }
        psi.Environment["DOTNET_CLI_TELEMETRY_OPTOUT"] = "1";
        return new ServeProcess(Process.Start(psi)!, httpPort);
    }

    /// <summary>GET /healthz as parsed JSON (null while it does not answer).</summary>
    public async Task<JsonDocument?> HealthAsync()
    {
        try
        {
            // 503 while unhealthy (broker disconnected) still carries the JSON body.
            using var response = await Http.GetAsync(new Uri("http://127.0.0.1:" + HttpPort.ToString(CultureInfo.InvariantCulture) + "/healthz")).ConfigureAwait(false);
            string text = await response.Content.ReadAsStringAsync().ConfigureAwait(false);
            return JsonDocument.Parse(text);
        }
        catch (HttpRequestException)
        {
            return null;
        }
        catch (TaskCanceledException)
        {
            return null;
        }
    }

    /// <summary>Waits until /healthz says the broker is connected.</summary>
    public async Task WaitConnectedAsync(TimeSpan timeout)
    {
        var deadline = DateTime.UtcNow + timeout;
        while (DateTime.UtcNow < deadline)
        {
            if (_process.HasExited)
            {
                throw new InvalidOperationException("runwatch serve exited: " + Output);
            }
            using var health = await HealthAsync().ConfigureAwait(false);
            if (health is not null && health.RootElement.GetProperty("checks").GetProperty("broker").GetProperty("status").GetString() == "Healthy")
            {
                return;
            }
            await Task.Delay(100).ConfigureAwait(false);
        }
        throw new TimeoutException("runwatch serve did not connect: " + Output);
    }

    /// <summary>GET /metrics text.</summary>
    public Task<string> MetricsAsync() => Http.GetStringAsync(new Uri("http://127.0.0.1:" + HttpPort.ToString(CultureInfo.InvariantCulture) + "/metrics"));

    /// <summary>SIGKILL: the process gets no chance to finish anything.</summary>
    public void Kill()
    {
        _process.Kill(entireProcessTree: true);
        _process.WaitForExit();
    }

    /// <summary>Peak resident set size (VmHWM) of the process, bytes.</summary>
    public long PeakRssBytes()
    {
        foreach (string line in File.ReadLines("/proc/" + _process.Id.ToString(CultureInfo.InvariantCulture) + "/status"))
        {
            if (line.StartsWith("VmHWM:", StringComparison.Ordinal))
            {
                return long.Parse(line.AsSpan(6).Trim().ToString().Replace(" kB", "", StringComparison.Ordinal), CultureInfo.InvariantCulture) * 1024;
            }
        }
        return -1;
    }

    /// <summary>Stops it with SIGTERM and waits.</summary>
    public async Task StopAsync()
    {
        if (_process.HasExited)
        {
            return;
        }
        using (var kill = Process.Start("kill", ["-TERM", _process.Id.ToString(CultureInfo.InvariantCulture)]))
        {
            await kill.WaitForExitAsync().ConfigureAwait(false);
        }
        using var timeout = new CancellationTokenSource(TimeSpan.FromSeconds(20));
        try
        {
            await _process.WaitForExitAsync(timeout.Token).ConfigureAwait(false);
        }
        catch (OperationCanceledException)
        {
            Kill();
        }
    }

    public async ValueTask DisposeAsync()
    {
        await StopAsync().ConfigureAwait(false);
        _process.Dispose();
    }

    private void Append(string? line)
    {
        if (line is null)
        {
            return;
        }
        lock (_output)
        {
            if (_output.Length < 200_000)
            {
                _output.AppendLine(line);
            }
        }
    }
}
