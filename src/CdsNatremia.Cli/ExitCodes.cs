namespace CdsNatremia.Cli;

/// <summary>The tool's exit codes, documented in docs/integration-guide.md and in the root --help.</summary>
internal static class ExitCodes
{
    /// <summary>Success; for conform, no violation; for load, no error.</summary>
    public const int Ok = 0;

    /// <summary>The check found something: a conformance violation, a load error, a replay card mismatch, unreadable input.</summary>
    public const int Failure = 1;

    /// <summary>The command line or an input file is not usable (bad option, missing file, unknown scenario).</summary>
    public const int Usage = 2;

    /// <summary>The target could not be reached, or is not allowed (not loopback and not named by --allow-host).</summary>
    public const int Unreachable = 3;

    /// <summary>The service answered with an HTTP error or an unreadable body.</summary>
    public const int ServiceError = 4;
}
