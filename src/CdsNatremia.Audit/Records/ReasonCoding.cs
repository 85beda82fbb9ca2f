namespace CdsNatremia.Audit.Records;

/// <summary>A CDS Hooks Coding for an override reason: system and code required, display optional.</summary>
/// <param name="System">The code system URI.</param>
/// <param name="Code">The code.</param>
/// <param name="Display">The display text, when sent.</param>
public sealed record ReasonCoding(string System, string Code, string? Display);
