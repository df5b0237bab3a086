using System.Reflection;
using System.Runtime.ExceptionServices;
using RunWatch.Storage;

namespace RunWatch.Ingest.Tests.Support;

/// <summary>
/// The real store behind a switch: while <see cref="Outage"/> is on, every write the daemon makes (batches, alerts,
/// the health probe) fails as a full or locked disk makes it fail. Not sealed: DispatchProxy derives from it.
/// </summary>
public class StoreOutageProxy : DispatchProxy
{
    private static readonly HashSet<string> Writes = new(StringComparer.Ordinal) { "WriteBatchAsync", "SaveAlertAsync", "ProbeWriteAsync", "SaveRunAsync", "AppendAuditAsync" };

    private IRunWatchStore _inner = default!;
    private Func<bool> _outage = default!;

    public static IRunWatchStore Wrap(IRunWatchStore inner, Func<bool> outage)
    {
        var proxy = Create<IRunWatchStore, StoreOutageProxy>();
        var self = (StoreOutageProxy)(object)proxy;
        self._inner = inner;
        self._outage = outage;
        return proxy;
    }

    protected override object? Invoke(MethodInfo? targetMethod, object?[]? args)
    {
        ArgumentNullException.ThrowIfNull(targetMethod);
        if (_outage() && Writes.Contains(targetMethod.Name))
        {
            throw new StoreUnavailableException("simulated store outage");
        }
        try
        {
            return targetMethod.Invoke(_inner, args);
        }
        catch (TargetInvocationException ex) when (ex.InnerException is not null)
        {
            ExceptionDispatchInfo.Throw(ex.InnerException);
            throw;
        }
    }
}
