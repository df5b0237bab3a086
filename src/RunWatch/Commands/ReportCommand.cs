using System.CommandLine;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using RunWatch.Storage;
using RunWatch.Wafers.Pipeline;

namespace RunWatch.Commands;

/// <summary><c>runwatch report WAFER</c>: writes a wafer's report files now, from what the store holds.</summary>
internal static class ReportCommand
{
    public static Command Create()
    {
        var wafer = new Argument<string>("WAFER") { Description = "Wafer id, e.g. W-0412-A." };
        var command = new Command("report", "Write the QC report (HTML, PDF, CSV of every wire, JSON summary) of one wafer from its stored run and analysed fields. "
            + "Configuration as for serve, e.g. --Storage:DataDirectory=demo-data.")
        {
            TreatUnmatchedTokensAsErrors = false,
        };
        command.Arguments.Add(wafer);
        command.SetAction(async (parseResult, cancellationToken) =>
        {
            string waferId = parseResult.GetValue(wafer)!;
            string[] args = [.. parseResult.UnmatchedTokens];
            var builder = Host.CreateApplicationBuilder(new HostApplicationBuilderSettings { Args = args, ContentRootPath = AppContext.BaseDirectory });
            builder.Logging.SetMinimumLevel(Microsoft.Extensions.Logging.LogLevel.Warning);
            builder.Services.AddRunWatchStorage(builder.Configuration);
            builder.Services.AddRunWatchWaferPipeline(builder.Configuration, runWorkers: false);
            using IHost host = builder.Build();
            var store = host.Services.GetRequiredService<IRunWatchStore>();
            try
            {
                await store.MigrateAsync(cancellationToken).ConfigureAwait(false);
                var onDemand = new ReportRequestRecord(0, waferId, DateTimeOffset.UtcNow, Environment.UserName + " (runwatch report)", "written on demand with runwatch report");
                WaferReportOutcome outcome = await host.Services.GetRequiredService<WaferReportService>().WriteAsync(waferId, onDemand, cancellationToken).ConfigureAwait(false);
                Console.WriteLine($"wafer {outcome.Wafer}: verdict {outcome.Verdict.Outcome.ToString().ToUpperInvariant()}, revision {outcome.Revision?.Revision} ({outcome.Revision?.Reason})");
                Console.WriteLine($"  content SHA-256 {outcome.Revision?.ContentSha256}");
                foreach (var reason in outcome.Verdict.Reasons)
                {
                    Console.WriteLine($"  {reason.Outcome.ToString().ToLowerInvariant()}: {reason.Reason}");
                }
                foreach (var (format, path) in outcome.Files)
                {
                    Console.WriteLine($"  {format,-4} {path}");
                }
                return 0;
            }
            catch (KeyNotFoundException ex)
            {
                Console.Error.WriteLine("runwatch report: " + ex.Message);
                return 2;
            }
            catch (StoreUnavailableException ex)
            {
                Console.Error.WriteLine("runwatch report: the store cannot be read: " + ex.Message);
                return 3;
            }
        });
        return command;
    }
}
