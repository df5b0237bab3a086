using System.CommandLine;
using Microsoft.Extensions.DependencyInjection;
using RunWatch.Demo;
using RunWatch.Hosting;
using RunWatch.Storage;
using RunWatch.Wafers.Pipeline;
using RunWatch.Web.Hosting;

namespace RunWatch.Commands;

/// <summary><c>runwatch demo</c>: the whole job on embedded defaults with an invented chamber and invented SEM fields.</summary>
internal static class DemoCommand
{
    public static Command Create()
    {
        var dataFolder = new Option<string>("--data-folder") { Description = "Folder for the demo's database, drop folder and reports (emptied at start).", DefaultValueFactory = _ => "demo-data" };
        var exitWhenDone = new Option<bool>("--exit-when-done") { Description = "Stop once every demo wafer has its report (for scripts and tests)." };
        var command = new Command("demo", "Run the whole job on embedded defaults: an invented chamber publishes four runs over MQTT (demo clock accelerated 120x), the daemon records them, "
            + "invented SEM fields of their wafers arrive, and each wafer gets its analysis, prediction, verdict and report. Demo data only.")
        {
            TreatUnmatchedTokensAsErrors = false,
        };
        command.Options.Add(dataFolder);
        command.Options.Add(exitWhenDone);
        command.SetAction(async (parseResult, cancellationToken) =>
        {
            string folder = RunWatch.Hosting.RuntimeFolders.Resolve(parseResult.GetValue(dataFolder)!);
            try
            {
                PrepareFolder(folder);
            }
            catch (Exception ex) when (ex is InvalidOperationException or IOException or UnauthorizedAccessException)
            {
                Console.Error.WriteLine("runwatch demo: " + ex.Message);
                return 2;
            }
            string[] args = [.. DemoSettings.Arguments(folder), .. parseResult.UnmatchedTokens];
            var builder = WebApplication.CreateBuilder(new WebApplicationOptions { Args = args, ContentRootPath = AppContext.BaseDirectory });
            builder.AddRunWatch(args);
            await using var app = builder.Build();
            // Demo users first, so the dashboard never starts without anyone able to log in.
            var demoUsers = app.CreateRunWatchDemoUsers();
            app.MapRunWatch();
            Console.WriteLine("RunWatch demo — invented chamber, invented process, invented SEM fields; nothing here is real data.");
            Console.WriteLine($"  data folder   {folder}");
            Console.WriteLine($"  MQTT broker   127.0.0.1:{builder.Configuration.GetValue("Broker:Port", DemoSettings.BrokerPort)} (embedded)");
            await app.StartAsync(cancellationToken).ConfigureAwait(false);
            // SIGTERM reaches the host's lifetime (which stops the application) but not the command line's token; a
            // demo stopped with kill or by a service manager must end as Ctrl+C does.
            using var stopping = CancellationTokenSource.CreateLinkedTokenSource(cancellationToken, app.Lifetime.ApplicationStopping);
            cancellationToken = stopping.Token;
            string url = app.Urls.FirstOrDefault() ?? "http://127.0.0.1:5080";
            Console.WriteLine($"  dashboard     {url}   (log in with a demo user below)");
            foreach (var user in demoUsers)
            {
                Console.WriteLine($"    demo user   {user.Name,-14} role {user.Role,-9} password {user.Password}");
            }
            Console.WriteLine($"  health        {url}/healthz, metrics {url}/metrics");
            var runner = new DemoRunner(
                app.Services.GetRequiredService<IRunWatchStore>(),
                app.Services.GetRequiredService<IWaferStore>(),
                app.Services.GetRequiredService<FieldIntakeService>(),
                app.Services.GetRequiredService<RunWatch.Ingest.Health.IngestHealth>(),
                builder.Configuration.GetValue("Broker:Port", DemoSettings.BrokerPort),
                TimeProvider.System,
                Console.Out);
            try
            {
                await runner.RunAsync(cancellationToken).ConfigureAwait(false);
            }
            catch (TimeoutException ex)
            {
                Console.Error.WriteLine("[demo] " + ex.Message + $"; see the log under {folder}");
                await app.StopAsync(CancellationToken.None).ConfigureAwait(false);
                return 1;
            }
            catch (Exception) when (cancellationToken.IsCancellationRequested)
            {
                // Ctrl+C or SIGTERM during the demo: the host stops the embedded broker too, so the publisher may fail
                // with a broken connection rather than a cancellation. Either way, stop cleanly below.
            }
            if (!parseResult.GetValue(exitWhenDone) && !cancellationToken.IsCancellationRequested)
            {
                Console.WriteLine("[demo] all demo wafers reported. The daemon keeps running; press Ctrl+C to stop.");
                try
                {
                    await Task.Delay(Timeout.Infinite, cancellationToken).ConfigureAwait(false);
                }
                catch (OperationCanceledException)
                {
                    // Ctrl+C
                }
            }
            await app.StopAsync(CancellationToken.None).ConfigureAwait(false);
            Console.WriteLine("[demo] stopped.");
            return 0;
        });
        return command;
    }

    /// <summary>Starts every demo from an empty folder so that it shows the same story each time.</summary>
    private static void PrepareFolder(string folder)
    {
        if (Directory.Exists(folder))
        {
            if (!File.Exists(Path.Combine(folder, ".runwatch-demo")) && Directory.EnumerateFileSystemEntries(folder).Any())
            {
                throw new InvalidOperationException($"{folder} exists and is not a RunWatch demo folder; choose another with --data-folder");
            }
            Directory.Delete(folder, recursive: true);
        }
        Directory.CreateDirectory(folder);
        File.WriteAllText(Path.Combine(folder, ".runwatch-demo"), "RunWatch demo data (invented). Deleted and re-created by each `runwatch demo`.\n");
        File.WriteAllText(Path.Combine(folder, "demo-chambers.json"), DemoSettings.ChambersJson());
    }
}
