using System.Security.Claims;
using Microsoft.AspNetCore.Components;
using Microsoft.AspNetCore.Components.Authorization;
using RunWatch.Web.Live;
using RunWatch.Web.Security;

namespace RunWatch.Web.Components.Shared;

/// <summary>
/// Base for pages that follow live data: subscribes to the hub, and on news re-runs <see cref="RefreshAsync"/> on
/// the circuit's renderer, at most once per redraw interval (later news during a redraw is coalesced).
/// </summary>
public abstract class LivePageBase : ComponentBase, IDisposable
{
    private IDisposable? _subscription;
    private int _pending;
    private bool _disposed;

    [Inject]
    protected LiveUpdateHub Hub { get; set; } = default!;

    [Inject]
    protected DashboardClock Clock { get; set; } = default!;

    [CascadingParameter]
    private Task<AuthenticationState>? AuthenticationStateTask { get; set; }

    protected ClaimsPrincipal User { get; private set; } = new();

    protected string UserName => User.Identity?.Name ?? "unknown";

    protected bool CanAct => DashboardRoles.All.Any(r => DashboardRoles.CanAct(r) && User.IsInRole(r));

    protected bool IsAdmin => User.IsInRole(DashboardRoles.Admin);

    /// <summary>Shortest time between two refreshes.</summary>
    protected virtual TimeSpan RedrawInterval => TimeSpan.FromMilliseconds(250);

    protected override async Task OnInitializedAsync()
    {
        if (AuthenticationStateTask is not null)
        {
            User = (await AuthenticationStateTask).User;
        }
        _subscription = Hub.Subscribe(OnLiveUpdate);
        await RefreshAsync();
    }

    /// <summary>Whether this update concerns the page.</summary>
    protected virtual bool Wants(LiveUpdate update) => true;

    /// <summary>Loads the page's data; called at start and after relevant news.</summary>
    protected abstract Task RefreshAsync();

    private void OnLiveUpdate(LiveUpdate update)
    {
        if (_disposed || !Wants(update) || Interlocked.Exchange(ref _pending, 1) == 1)
        {
            return;
        }
        _ = InvokeAsync(async () =>
        {
            try
            {
                await Task.Delay(RedrawInterval);
                Interlocked.Exchange(ref _pending, 0);
                if (!_disposed)
                {
                    await RefreshAsync();
                    StateHasChanged();
                }
            }
            catch (Exception ex) when (ex is not OperationCanceledException)
            {
                Interlocked.Exchange(ref _pending, 0);
                await DispatchExceptionAsync(ex);
            }
        });
    }

    public void Dispose()
    {
        _disposed = true;
        _subscription?.Dispose();
        Dispose(true);
        GC.SuppressFinalize(this);
    }

    protected virtual void Dispose(bool disposing)
    {
    }
}
