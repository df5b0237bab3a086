using Microsoft.Extensions.Hosting;
using RunWatch.Storage;
using RunWatch.Web.Safety;

namespace RunWatch.Web.Hosting;

/// <summary>
/// At host start, after the store is migrated: seeds the QC specifications and reminder settings from configuration
/// where the store has none, and puts the stored reminder thresholds and role bindings in force.
/// </summary>
internal sealed class StoredSettingsStartupService(ReminderRuleEditor reminders, ReminderBindings bindings, QcSpecificationCatalog? specifications = null) : IHostedService
{
    public async Task StartAsync(CancellationToken cancellationToken)
    {
        await reminders.LoadAsync(cancellationToken).ConfigureAwait(false);
        await bindings.LoadAsync(cancellationToken).ConfigureAwait(false);
        if (specifications is not null)
        {
            await specifications.ListAsync(cancellationToken).ConfigureAwait(false);
        }
    }

    public Task StopAsync(CancellationToken cancellationToken) => Task.CompletedTask;
}
