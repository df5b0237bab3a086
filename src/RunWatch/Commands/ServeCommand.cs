using System.CommandLine;
using RunWatch.Hosting;

namespace RunWatch.Commands;

/// <summary><c>runwatch serve</c>: the daemon. Extra <c>--Section:Key=value</c> arguments are configuration.</summary>
internal static class ServeCommand
{
    public static Command Create()
    {
        var command = new Command("serve", "Run the chamber daemon: MQTT ingest into the store, run tracking, alerts, /healthz and /metrics. "
            + "Configuration: appsettings.json, environment variables (Section__Key), and --Section:Key=value arguments; see config/README.md.")
        {
            TreatUnmatchedTokensAsErrors = false,
        };
        command.SetAction(async (parseResult, cancellationToken) =>
        {
            string[] args = [.. parseResult.UnmatchedTokens];
            var builder = WebApplication.CreateBuilder(new WebApplicationOptions { Args = args, ContentRootPath = AppContext.BaseDirectory });
            builder.AddRunWatch(args);
            await using var app = builder.Build();
            app.MapRunWatch();
            await app.RunAsync(cancellationToken).ConfigureAwait(false);
            return 0;
        });
        return command;
    }
}
