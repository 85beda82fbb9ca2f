namespace CdsNatremia.Cli;

/// <summary>A failure the tool explains to its user in one sentence, with the exit code it ends with.</summary>
internal sealed class ToolException : Exception
{
    public ToolException(int exitCode, string message)
        : base(message) => ExitCode = exitCode;

    public ToolException()
    {
    }

    public ToolException(string message)
        : base(message)
    {
    }

    public ToolException(string message, Exception innerException)
        : base(message, innerException)
    {
    }

    /// <summary>The process exit code (see <see cref="ExitCodes"/>).</summary>
    public int ExitCode { get; } = ExitCodes.Failure;
}
