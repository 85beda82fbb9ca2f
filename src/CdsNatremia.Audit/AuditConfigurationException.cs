namespace CdsNatremia.Audit;

/// <summary>
/// A setting of the audit trail that stops start-up (missing or unusable pseudonym key). The message names the setting
/// and the fix in one sentence, so the host can print it as one log line.
/// </summary>
public sealed class AuditConfigurationException : InvalidOperationException
{
    /// <summary>Creates the exception.</summary>
    public AuditConfigurationException(string message)
        : base(message)
    {
    }

    /// <summary>Creates the exception with its cause.</summary>
    public AuditConfigurationException(string message, Exception innerException)
        : base(message, innerException)
    {
    }

    /// <summary>Creates the exception without a message (for serializers).</summary>
    public AuditConfigurationException()
    {
    }
}
