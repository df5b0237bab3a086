namespace RunWatch.Storage;

/// <summary>The store could not complete a write (disk full, database locked, I/O error). Nothing of the write was kept.</summary>
public sealed class StoreUnavailableException : Exception
{
    /// <summary>Creates the exception.</summary>
    public StoreUnavailableException()
    {
    }

    /// <summary>Creates the exception with a message.</summary>
    public StoreUnavailableException(string message)
        : base(message)
    {
    }

    /// <summary>Creates the exception with a message and the provider's error.</summary>
    public StoreUnavailableException(string message, Exception innerException)
        : base(message, innerException)
    {
    }
}
