using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using RunWatch.Wafers.Intake;
using RunWatch.Storage;

namespace RunWatch.Wafers.Pipeline;

/// <summary>
/// Watches the drop folder: file-system events wake it early, a periodic rescan catches whatever events miss
/// (network shares, bursts), and only files that have stopped growing are taken in. Unassigned fields are retried
/// on each pass, so a field that arrived before its run's events is picked up once a run names its wafer.
/// </summary>
public sealed class FieldIntakeService(
    FieldIntake intake,
    IOptions<IntakeOptions> options,
    IOptions<StorageOptions> storage,
    TimeProvider time,
    ILogger<FieldIntakeService> logger) : BackgroundService
{
    private readonly SemaphoreSlim _wake = new(0, 1);

    /// <summary>The drop folder being watched (absolute).</summary>
    public string DropFolder { get; } = Path.GetFullPath(Path.Combine(storage.Value.DataDirectory, options.Value.DropFolder));

    /// <summary>Files refused so far (name and reason), newest last; bounded.</summary>
    public IReadOnlyList<RefusedFile> Refused => _refused.ToArray();

    private readonly Queue<RefusedFile> _refused = new();

    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        Directory.CreateDirectory(DropFolder);
        var scanner = new DropFolderScanner(DropFolder, options.Value.StableFor);
        using var watcher = new FileSystemWatcher(DropFolder) { IncludeSubdirectories = true, EnableRaisingEvents = true };
        watcher.Created += (_, _) => Wake();
        watcher.Changed += (_, _) => Wake();
        watcher.Renamed += (_, _) => Wake();
        var arrived = new List<ArrivedField>();
        var refused = new List<RefusedFile>();
        while (!stoppingToken.IsCancellationRequested)
        {
            arrived.Clear();
            refused.Clear();
            try
            {
                scanner.Scan(time.GetUtcNow(), arrived, refused);
                foreach (RefusedFile r in refused)
                {
                    await RefuseAsync(r, stoppingToken).ConfigureAwait(false);
                }
                foreach (ArrivedField field in arrived)
                {
                    try
                    {
                        await intake.TakeInAsync(field, stoppingToken).ConfigureAwait(false);
                    }
                    catch (Exception ex) when (ex is not OperationCanceledException and not StoreUnavailableException)
                    {
                        // Whatever a file does to intake, it becomes a stored, visible refusal; the watcher goes on.
                        Log.IntakeFailed(logger, field.RelativePath, ex.Message);
                        await RefuseAsync(new RefusedFile(field.RelativePath, "could not be taken in: " + ex.Message), stoppingToken).ConfigureAwait(false);
                    }
                }
                await intake.RetryUnassignedAsync(stoppingToken).ConfigureAwait(false);
            }
            catch (OperationCanceledException) when (stoppingToken.IsCancellationRequested)
            {
                break;
            }
            catch (Exception ex) when (ex is IOException or StoreUnavailableException or UnauthorizedAccessException)
            {
                Log.ScanFailed(logger, ex);
            }
            // Poll faster while files are still growing, so a finished file is taken in soon after it settles.
            TimeSpan wait = scanner.Pending > 0 ? TimeSpan.FromMilliseconds(Math.Max(100, options.Value.StableFor.TotalMilliseconds / 2)) : options.Value.RescanInterval;
            try
            {
                await _wake.WaitAsync(wait, stoppingToken).ConfigureAwait(false);
            }
            catch (OperationCanceledException)
            {
                break;
            }
        }
    }

    private async Task RefuseAsync(RefusedFile refusal, CancellationToken cancellationToken)
    {
        Log.FileRefused(logger, refusal.RelativePath, refusal.Reason);
        _refused.Enqueue(refusal);
        while (_refused.Count > 200)
        {
            _refused.Dequeue();
        }
        await intake.RecordRefusalAsync(Path.Combine(DropFolder, refusal.RelativePath), refusal.RelativePath, refusal.Reason, cancellationToken).ConfigureAwait(false);
    }

    private void Wake()
    {
        try
        {
            if (_wake.CurrentCount == 0)
            {
                _wake.Release();
            }
        }
        catch (SemaphoreFullException)
        {
            // already awake
        }
    }

    public override void Dispose()
    {
        _wake.Dispose();
        base.Dispose();
    }
}
