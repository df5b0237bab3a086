using System.Diagnostics;
using System.Globalization;
using System.Text;

namespace RunWatch.Testing.Mqtt;

/// <summary>
/// A real Mosquitto broker (Debian's /usr/sbin/mosquitto) on a free loopback port with a generated config:
/// anonymous loopback listener, <c>max_queued_messages 0</c> (unlimited: the 1000 default drops silently), a large
/// in-flight window, and optional persistence in a temp folder. Restartable on the same port and persistence file.
/// </summary>
public sealed class MosquittoBroker : IAsyncDisposable
{
    private readonly bool _persistence;
    private Process? _process;
    private readonly StringBuilder _log = new();

    private string? _customConfig;


    private MosquittoBroker(bool persistence)
    {
        _persistence = persistence;
        Folder = Directory.CreateTempSubdirectory("runwatch-mosquitto-").FullName;
        Port = FreePort.Next();
    }

    public const string Executable = "/usr/sbin/mosquitto";

    public int Port { get; }

    public string Folder { get; }

    public string ConfigPath => Path.Combine(Folder, "mosquitto.conf");

    /// <summary>Everything the broker wrote to stdout/stderr so far.</summary>
    public string Output
    {
        get
        {
            lock (_log)
            {
                return _log.ToString();
            }
        }
    }

    /// <summary>Starts a broker; with <paramref name="persistence"/> it snapshots sessions and queued messages to disk.</summary>
    public static async Task<MosquittoBroker> StartAsync(bool persistence = false, int maxInflightMessages = 0)
    {
        if (!File.Exists(Executable))
        {
            throw new InvalidOperationException(Executable + " not found: install the Debian package mosquitto (tests/run.sh does).");
        }
        var broker = new MosquittoBroker(persistence);
        broker.WriteConfig(maxInflightMessages);
        await broker.StartProcessAsync().ConfigureAwait(false);
        return broker;
    }

    /// <summary>
    /// Starts a broker with a config of the caller's: <paramref name="config"/> gets the port and the broker's temp
    /// folder and returns the whole file (for TLS and authentication tests).
    /// </summary>
    public static async Task<MosquittoBroker> StartWithConfigAsync(Func<int, string, string> config)
    {
        ArgumentNullException.ThrowIfNull(config);
        var broker = new MosquittoBroker(persistence: false);
        broker._customConfig = config(broker.Port, broker.Folder);
        File.WriteAllText(broker.ConfigPath, broker._customConfig);
        await broker.StartProcessAsync().ConfigureAwait(false);
        return broker;
    }

    /// <summary>Stops the broker gracefully (SIGTERM: Mosquitto writes its persistence file on the way out).</summary>
    public async Task StopAsync()
    {
        if (_process is null || _process.HasExited)
        {
            return;
        }
        using (var kill = Process.Start("kill", ["-TERM", _process.Id.ToString(CultureInfo.InvariantCulture)]))
        {
            await kill.WaitForExitAsync().ConfigureAwait(false);
        }
        using var timeout = new CancellationTokenSource(TimeSpan.FromSeconds(10));
        await _process.WaitForExitAsync(timeout.Token).ConfigureAwait(false);
        _process.Dispose();
        _process = null;
    }

    /// <summary>Starts it again on the same port with the same persistence folder.</summary>
    public Task RestartAsync() => StartProcessAsync();

    public async ValueTask DisposeAsync()
    {
        if (_process is { HasExited: false })
        {
            _process.Kill();
            await _process.WaitForExitAsync().ConfigureAwait(false);
        }
        _process?.Dispose();
        try
        {
            Directory.Delete(Folder, recursive: true);
        }
        catch (IOException)
        {
            // A file still held open by a dying process; the temp folder is cleaned by the OS later.
        }
    }

    private void WriteConfig(int maxInflightMessages)
    {
        var conf = new StringBuilder();
        conf.AppendLine(CultureInfo.InvariantCulture, $"listener {Port} 127.0.0.1");
        conf.AppendLine("allow_anonymous true");
        conf.AppendLine("max_queued_messages 0");
        conf.AppendLine("max_queued_bytes 0");
        conf.AppendLine(CultureInfo.InvariantCulture, $"max_inflight_messages {maxInflightMessages}");
        conf.AppendLine("persistent_client_expiration 1d");
        conf.AppendLine("log_dest stdout");
        conf.AppendLine("log_type error");
        conf.AppendLine("log_type warning");
        conf.AppendLine("log_type notice");
        if (_persistence)
        {
            conf.AppendLine("persistence true");
            conf.AppendLine(CultureInfo.InvariantCulture, $"persistence_location {Folder}/");
            conf.AppendLine("persistence_file mosquitto.db");
            conf.AppendLine("autosave_interval 1");
        }
        else
        {
            conf.AppendLine("persistence false");
        }
        File.WriteAllText(ConfigPath, conf.ToString());
    }

    private async Task StartProcessAsync()
    {
        var psi = new ProcessStartInfo(Executable)
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        psi.ArgumentList.Add("-c");
        psi.ArgumentList.Add(ConfigPath);
        var process = new Process { StartInfo = psi };
        process.OutputDataReceived += (_, e) => Append(e.Data);
        process.ErrorDataReceived += (_, e) => Append(e.Data);
        process.Start();
        process.BeginOutputReadLine();
        process.BeginErrorReadLine();
        _process = process;
        await FreePort.WaitForListenerAsync(Port, TimeSpan.FromSeconds(10)).ConfigureAwait(false);
    }

    private void Append(string? line)
    {
        if (line is null)
        {
            return;
        }
        lock (_log)
        {
            _log.AppendLine(line);
        }
    }
}
