using System.Diagnostics;
using System.Globalization;
using System.Text;
using Microsoft.Data.Sqlite;
using RunWatch.Testing.Mqtt;

namespace RunWatch.Benchmarks;

/// <summary>
/// Telemetry through a real Mosquitto at QoS 1 into a real <c>runwatch serve</c> process and its SQLite store, with a
/// bare <c>mosquitto_sub -q 1</c> draining the same stream at the same time as the peer. Reports both rates and their
/// ratio (goal ≥ 0.8), publish-to-commit latency at a steady 2,000 samples/s (goal p99 ≤ 250 ms) and the daemon's
/// peak RSS after the long run (goal ≤ 200 MB). One sample per message: the hardest case for the committer.
/// </summary>
internal sealed class IngestBenchmark : IBenchmark
{
    private const string Topic = "runwatch/lab/C1/telemetry";

    public string Name => "ingest";

    public string Description => "MQTT QoS 1 ingest into SQLite vs a bare mosquitto_sub; latency at 2000 samples/s; peak RSS";

    public int Run(bool quick, TextWriter output) => RunAsync(quick, output).GetAwaiter().GetResult();

    private static async Task<int> RunAsync(bool quick, TextWriter output)
    {
        int burst = quick ? 50_000 : 200_000;
        int steadySeconds = quick ? 10 : 60;
        int longRun = quick ? 200_000 : 2_000_000;
        await using var broker = await MosquittoBroker.StartAsync();
        string folder = Directory.CreateTempSubdirectory("runwatch-bench-").FullName;
        string database = Path.Combine(folder, "runwatch.db");
        try
        {
            var settings = DaemonSettings.ForServe(broker.Port, folder, "runwatch-bench");
            await using var publisher = await MqttTestPublisher.ConnectAsync(broker.Port, "bench-publisher");
            long seq = 0;

            // 1. Throughput. Both consumers hold persistent QoS 1 sessions; the burst is queued at the broker while both
            //    are away, then both start together and drain the same stream. Each rate runs from its first to its last sample.
            var subscribe = ServeProcess.Start(folder, settings);
            await subscribe.WaitConnectedAsync(TimeSpan.FromSeconds(30));
            await subscribe.StopAsync();
            await subscribe.DisposeAsync();
            using (var registerBare = StartBareSubscriber(broker.Port, 1))
            {
                await Task.Delay(500);
                await publisher.PublishAsync(Topic, Payload(seq++, DateTimeOffset.UtcNow));
                await registerBare.WaitForExitAsync().WaitAsync(TimeSpan.FromSeconds(20));
            }
            int acked = await publisher.PublishManyAsync(Topic, (int)seq, burst, i => Payload(i, DateTimeOffset.UtcNow), maxInFlight: 1000);
            seq += burst;
            long target = seq;

            var bareTimes = new long[2];
            long bareLines = 0;
            using var bare = StartBareSubscriber(broker.Port, burst);
            bare.OutputDataReceived += (_, e) =>
            {
                if (e.Data is null)
                {
                    return;
                }
                long n = Interlocked.Increment(ref bareLines);
                if (n == 1)
                {
                    Volatile.Write(ref bareTimes[0], Stopwatch.GetTimestamp());
                }
                Volatile.Write(ref bareTimes[1], Stopwatch.GetTimestamp());
            };
            bare.BeginOutputReadLine();
            await using var daemon = ServeProcess.Start(folder, settings);
            long daemonFirst = await WaitCountAsync(database, 2, TimeSpan.FromSeconds(60));
            long firstCount = Count(database);
            long daemonLast = await WaitCountAsync(database, target, TimeSpan.FromSeconds(300));
            await bare.WaitForExitAsync().WaitAsync(TimeSpan.FromSeconds(120));
            double daemonS = Stopwatch.GetElapsedTime(daemonFirst, daemonLast).TotalSeconds;
            double bareS = Stopwatch.GetElapsedTime(Volatile.Read(ref bareTimes[0]), Volatile.Read(ref bareTimes[1])).TotalSeconds;
            double daemonRate = (target - firstCount) / daemonS;
            double bareRate = (Interlocked.Read(ref bareLines) - 1) / bareS;
            output.WriteLine(string.Create(CultureInfo.InvariantCulture, $"   burst of {burst:N0} samples queued at the broker (1 per message, QoS 1, {acked:N0} acked), then drained by both at once"));
            output.WriteLine(string.Create(CultureInfo.InvariantCulture, $"   daemon (runwatch serve -> SQLite, synchronous=FULL): {daemonRate,10:N0} samples/s  ({daemonS:F2} s first to last commit)"));
            output.WriteLine(string.Create(CultureInfo.InvariantCulture, $"   bare mosquitto_sub -q 1 (peer, same stream):        {bareRate,10:N0} samples/s  ({bareS:F2} s first to last message)"));
            output.WriteLine(string.Create(CultureInfo.InvariantCulture, $"   ratio daemon / bare subscriber: {daemonRate / bareRate:F2}  (goal >= 0.8)"));
            await daemon.WaitConnectedAsync(TimeSpan.FromSeconds(30));
            var m = await daemon.MetricsAsync();
            output.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"   daemon time split: commit {Sum(m, "runwatch_ingest_batch_commit_seconds_sum"):F2} s, acks {Sum(m, "runwatch_ingest_batch_ack_seconds_sum"):F2} s, {Sum(m, "runwatch_ingest_batch_messages_count"):F0} batches of {Sum(m, "runwatch_ingest_batch_messages_sum") / Math.Max(1, Sum(m, "runwatch_ingest_batch_messages_count")):F0} messages on average"));

            // 2. Latency at a steady 2,000 samples/s: commit time minus the publisher's own sample time, from the daemon's histogram.
            string beforeMetrics = await daemon.MetricsAsync();
            var before = Buckets(beforeMetrics, LagSeries);
            int steadyCount = 2000 * steadySeconds;
            await PublishSteadyAsync(publisher, seq, steadyCount, 2000);
            seq += steadyCount;
            await WaitCountAsync(database, seq, TimeSpan.FromSeconds(120));
            string afterMetrics = await daemon.MetricsAsync();
            var delta = Delta(Buckets(beforeMetrics, LagSeries), Buckets(afterMetrics, LagSeries));
            output.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"   steady 2,000 samples/s for {steadySeconds} s: publish-to-commit p50 {Quantile(delta, 0.50) * 1000:F1} ms, p99 {Quantile(delta, 0.99) * 1000:F1} ms  (goal p99 <= 250 ms; from histogram buckets 25 % wide, interpolated)"));
            // Where a slow sample's time went: the committer's own write and ack times over the same interval.
            var commits = Delta(Buckets(beforeMetrics, CommitSeries), Buckets(afterMetrics, CommitSeries));
            var acks = Delta(Buckets(beforeMetrics, AckSeries), Buckets(afterMetrics, AckSeries));
            output.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"   same interval: {commits[^1].Count:F0} batches, commit p50 {Quantile(commits, 0.50) * 1000:F1} ms, p99 {Quantile(commits, 0.99) * 1000:F1} ms, slowest <= {Slowest(commits) * 1000:F0} ms; acks p99 {Quantile(acks, 0.99) * 1000:F1} ms"));

            // 3. Peak RSS after the long run.
            int remaining = longRun - (int)seq;
            const int Chunk = 50_000;
            for (int done = 0; done < remaining; done += Chunk)
            {
                int n = Math.Min(Chunk, remaining - done);
                await publisher.PublishManyAsync(Topic, (int)seq, n, i => Payload(i, DateTimeOffset.UtcNow), maxInFlight: 1000);
                seq += n;
            }
            await WaitCountAsync(database, seq, TimeSpan.FromSeconds(900));
            double rssMb = daemon.PeakRssBytes() / (1024.0 * 1024.0);
            output.WriteLine(string.Create(CultureInfo.InvariantCulture, $"   daemon peak RSS (VmHWM) after {seq:N0} samples: {rssMb:F0} MB  (goal <= 200 MB)"));
            return 0;
        }
        finally
        {
            SqliteConnection.ClearAllPools();
            try
            {
                Directory.Delete(folder, recursive: true);
            }
            catch (IOException)
            {
                // The daemon may still hold the WAL for a moment; the temp folder is left for the OS.
            }
        }
    }

    /// <summary>mosquitto_sub with a persistent session (-c) that exits after <paramref name="count"/> messages.</summary>
    private static Process StartBareSubscriber(int port, int count)
    {
        var psi = new ProcessStartInfo(MosquittoClients.Sub) { RedirectStandardOutput = true, UseShellExecute = false };
        foreach (string a in new[] { "-h", "127.0.0.1", "-p", port.ToString(CultureInfo.InvariantCulture), "-q", "1", "-c", "-t", Topic, "-i", "bench-bare-sub", "-C", count.ToString(CultureInfo.InvariantCulture) })
        {
            psi.ArgumentList.Add(a);
        }
        return Process.Start(psi)!;
    }

    private static async Task PublishSteadyAsync(MqttTestPublisher publisher, long firstSeq, int count, int perSecond)
    {
        var clock = Stopwatch.StartNew();
        const int Slice = 20;
        for (int sent = 0; sent < count; sent += Slice)
        {
            var due = TimeSpan.FromSeconds(sent / (double)perSecond) - clock.Elapsed;
            if (due > TimeSpan.Zero)
            {
                await Task.Delay(due);
            }
            int n = Math.Min(Slice, count - sent);
            await publisher.PublishManyAsync(Topic, (int)(firstSeq + sent), n, i => Payload(i, DateTimeOffset.UtcNow), maxInFlight: n);
        }
    }

    private static async Task<long> WaitCountAsync(string database, long target, TimeSpan timeout)
    {
        var deadline = Stopwatch.GetTimestamp() + (long)(timeout.TotalSeconds * Stopwatch.Frequency);
        while (true)
        {
            long now = Stopwatch.GetTimestamp();
            if (Count(database) >= target)
            {
                return now;
            }
            if (now > deadline)
            {
                throw new TimeoutException(string.Create(CultureInfo.InvariantCulture, $"only {Count(database)} of {target} samples stored"));
            }
            await Task.Delay(20);
        }
    }

    private static async Task WaitAsync(Func<bool> condition, TimeSpan timeout)
    {
        var deadline = DateTime.UtcNow + timeout;
        while (!condition())
        {
            if (DateTime.UtcNow > deadline)
            {
                throw new TimeoutException("consumers not ready");
            }
            await Task.Delay(20);
        }
    }

    private static long Count(string database)
    {
        if (!File.Exists(database))
        {
            return 0;
        }
        try
        {
            using var connection = new SqliteConnection("Data Source=" + database + ";Mode=ReadOnly;Pooling=False");
            connection.Open();
            using var command = connection.CreateCommand();
            command.CommandText = "SELECT COUNT(*) FROM samples";
            return (long)command.ExecuteScalar()!;
        }
        catch (SqliteException)
        {
            return 0;
        }
    }

    private static double Sum(string metrics, string series)
    {
        foreach (string line in metrics.Split('\n'))
        {
            if (line.StartsWith(series + " ", StringComparison.Ordinal))
            {
                return double.Parse(line[(series.Length + 1)..], CultureInfo.InvariantCulture);
            }
        }
        return double.NaN;
    }

    private const string LagSeries = "runwatch_ingest_commit_lag_seconds";
    private const string CommitSeries = "runwatch_ingest_batch_commit_seconds";
    private const string AckSeries = "runwatch_ingest_batch_ack_seconds";

    private static List<(double Le, double Count)> Delta(List<(double Le, double Count)> before, List<(double Le, double Count)> after) =>
        after.Select((b, i) => (b.Le, Count: b.Count - (i < before.Count ? before[i].Count : 0))).ToList();

    /// <summary>Upper bound of the lowest bucket that holds every observation.</summary>
    private static double Slowest(List<(double Le, double Count)> cumulative)
    {
        foreach (var (le, count) in cumulative)
        {
            if (count >= cumulative[^1].Count)
            {
                return le;
            }
        }
        return double.PositiveInfinity;
    }

    private static List<(double Le, double Count)> Buckets(string metrics, string series)
    {
        string prefix = series + "_bucket{le=\"";
        var buckets = new List<(double, double)>();
        foreach (string line in metrics.Split('\n'))
        {
            if (!line.StartsWith(prefix, StringComparison.Ordinal))
            {
                continue;
            }
            int end = line.IndexOf('"', prefix.Length);
            string le = line[prefix.Length..end];
            double bound = le == "+Inf" ? double.PositiveInfinity : double.Parse(le, CultureInfo.InvariantCulture);
            buckets.Add((bound, double.Parse(line[(line.LastIndexOf(' ') + 1)..], CultureInfo.InvariantCulture)));
        }
        return buckets;
    }

    /// <summary>Quantile from cumulative bucket counts, linear within the bucket (the usual Prometheus estimate).</summary>
    private static double Quantile(List<(double Le, double Count)> cumulative, double q)
    {
        double total = cumulative[^1].Count;
        if (total <= 0)
        {
            return double.NaN;
        }
        double rank = q * total;
        double lower = 0;
        double below = 0;
        foreach (var (le, count) in cumulative)
        {
            if (count >= rank)
            {
                if (double.IsPositiveInfinity(le))
                {
                    return lower;
                }
                return lower + ((le - lower) * (rank - below) / Math.Max(1e-12, count - below));
            }
            lower = le;
            below = count;
        }
        return lower;
    }

    private static byte[] Payload(long seq, DateTimeOffset at) => Encoding.UTF8.GetBytes(string.Create(CultureInfo.InvariantCulture,
        $"{{\"t\":\"{at.UtcDateTime:yyyy-MM-dd'T'HH:mm:ss.ffffff'Z'}\",\"seq\":{seq},\"values\":{{\"substrate_tc\":{600 + (seq % 50) * 0.1:F1}}}}}"));
}
