namespace CdsNatremia.Service.Configuration;

/// <summary>A setting that stops start-up; the message names the setting and the fix in one sentence.</summary>
public sealed class StartupConfigurationException : InvalidOperationException
{
    /// <summary>Creates the exception.</summary>
    public StartupConfigurationException(string message)
        : base(message)
    {
    }

    /// <summary>Creates the exception with its cause.</summary>
    public StartupConfigurationException(string message, Exception innerException)
        : base(message, innerException)
    {
    }

    /// <summary>Creates the exception without a message (for serializers).</summary>
    public StartupConfigurationException()
    {
    }
}
