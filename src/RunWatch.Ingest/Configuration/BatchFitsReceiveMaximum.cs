using Microsoft.Extensions.Options;

namespace RunWatch.Ingest.Configuration;

/// <summary>
/// A batch waits for acknowledgement as a whole, so it must fit in the broker's in-flight window (Receive Maximum),
/// or the broker stops sending before the batch is full and every batch waits out its time bound.
/// </summary>
internal sealed class BatchFitsReceiveMaximum(IOptions<BrokerOptions> broker) : IValidateOptions<IngestOptions>
{
    public ValidateOptionsResult Validate(string? name, IngestOptions options) =>
        options.MaxBatchMessages <= broker.Value.ReceiveMaximum
            ? ValidateOptionsResult.Success
            : ValidateOptionsResult.Fail("Ingest:MaxBatchMessages must not exceed Broker:ReceiveMaximum");
}
