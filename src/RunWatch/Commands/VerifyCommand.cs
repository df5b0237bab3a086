using System.CommandLine;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using RunWatch.Storage;
using RunWatch.Wafers.Records;

namespace RunWatch.Commands;

/// <summary>
/// <c>runwatch verify REPORT</c>: recomputes a report revision's file hashes and content hash (and the input images'
/// hashes where they are still present) and compares them with the revision's manifest and the store's record.
/// Exit 0 when everything matches, 1 on any mismatch, 2 when REPORT is not a report revision.
/// </summary>
internal static class VerifyCommand
{
    public static Command Create()
    {
        var report = new Argument<string>("REPORT") { Description = "A report revision's folder (reports/<wafer>/r<N>) or any file in it." };
        var noStore = new Option<bool>("--no-store") { Description = "Check against the revision's own manifest only; do not open the store." };
        var command = new Command("verify", "Check that a report revision is what was issued: every file's SHA-256, the content hash, the input images' "
            + "hashes where they still exist, and the store's record. Configuration as for serve, e.g. --Storage:DataDirectory=demo-data.")
        {
            TreatUnmatchedTokensAsErrors = false,
        };
        command.Arguments.Add(report);
        command.Options.Add(noStore);
        command.SetAction(async (parseResult, cancellationToken) =>
        {
            string path = parseResult.GetValue(report)!;
            IReportRevisionStore? store = null;
            IHost? host = null;
            try
            {
                if (!parseResult.GetValue(noStore))
                {
                    var builder = Host.CreateApplicationBuilder(new HostApplicationBuilderSettings { Args = [.. parseResult.UnmatchedTokens], ContentRootPath = AppContext.BaseDirectory });
                    builder.Logging.SetMinimumLevel(Microsoft.Extensions.Logging.LogLevel.Warning);
                    builder.Services.AddRunWatchStorage(builder.Configuration);
                    host = builder.Build();
                    var options = host.Services.GetRequiredService<Microsoft.Extensions.Options.IOptions<StorageOptions>>().Value;
                    // Verifying never creates a database: a SQLite file that does not exist means "no store".
                    if (!string.Equals(options.Provider, "Sqlite", StringComparison.OrdinalIgnoreCase) || File.Exists(options.DatabasePath))
                    {
                        store = host.Services.GetRequiredService<IReportRevisionStore>();
                    }
                }
                ReportVerification result;
                try
                {
                    result = await ReportRevisionVerifier.VerifyAsync(path, store, cancellationToken).ConfigureAwait(false);
                }
                catch (StoreUnavailableException ex)
                {
                    Console.Error.WriteLine("runwatch verify: the store cannot be read (" + ex.Message + "); checking against the manifest only");
                    result = await ReportRevisionVerifier.VerifyAsync(path, null, cancellationToken).ConfigureAwait(false);
                }
                if (result.Wafer is null)
                {
                    foreach (string p in result.Problems)
                    {
                        Console.Error.WriteLine("runwatch verify: " + p);
                    }
                    return 2;
                }
                foreach (string note in result.Notes)
                {
                    Console.WriteLine("note: " + note);
                }
                if (!result.Verified)
                {
                    Console.Error.WriteLine($"MISMATCH: wafer {result.Wafer} revision {result.Revision} is not what was issued:");
                    foreach (string p in result.Problems)
                    {
                        Console.Error.WriteLine("  " + p);
                    }
                    return 1;
                }
                Console.WriteLine($"verified: wafer {result.Wafer} revision {result.Revision}, content SHA-256 {result.ContentSha256}");
                return 0;
            }
            finally
            {
                host?.Dispose();
            }
        });
        return command;
    }
}
