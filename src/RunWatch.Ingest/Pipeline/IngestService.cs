using Microsoft.Extensions.Hosting;

namespace RunWatch.Ingest.Pipeline;

/// <summary>Hosts the single committer of the ingest pipeline.</summary>
internal sealed class IngestService(IngestPipeline pipeline) : BackgroundService
{
    protected override Task ExecuteAsync(CancellationToken stoppingToken) => pipeline.RunAsync(stoppingToken);
}
