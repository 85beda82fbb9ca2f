namespace CdsNatremia.Service.Security;

/// <summary>The shared replay store could not be asked; the token is refused (503) rather than accepted unchecked.</summary>
public sealed class ReplayStoreUnavailableException : Exception
{
    /// <summary>Creates the exception.</summary>
    public ReplayStoreUnavailableException(string message, Exception innerException)
        : base(message, innerException)
    {
    }

    /// <summary>Creates the exception.</summary>
    public ReplayStoreUnavailableException(string message)
        : base(message)
    {
    }

    /// <summary>Creates the exception.</summary>
    public ReplayStoreUnavailableException()
    {
    }
}
