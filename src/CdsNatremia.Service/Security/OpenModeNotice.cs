namespace CdsNatremia.Service.Security;

/// <summary>
/// The warning shown while no trusted client is configured (Development only): at start-up in the log, and in
/// discovery as each service's <c>usageRequirements</c> (a standard CDS Hooks 2.0 field, so the document stays valid).
/// </summary>
internal static class OpenModeNotice
{
    public const string Text =
        "WARNING: client authentication is OFF (no trusted CDS clients configured; Development environment only). "
        + "Any caller can use this service. Never connect it to real patient data in this mode; see docs/security.md.";

    /// <summary>The service's own usage text with the warning added when the service runs open.</summary>
    public static string? UsageRequirements(string? usage, bool open)
        => !open ? usage : string.IsNullOrEmpty(usage) ? Text : usage + " " + Text;
}
