namespace CdsNatremia.Core.Facts;

/// <summary>A code in a code system (a FHIR Coding without the FHIR SDK). Equality is by system and code.</summary>
/// <param name="System">The code system URI, e.g. "http://loinc.org".</param>
/// <param name="Code">The code.</param>
/// <param name="Display">Optional human text; not part of equality.</param>
public readonly record struct CodeRef(string System, string Code, string? Display = null)
{
    /// <inheritdoc />
    public bool Equals(CodeRef other)
        => string.Equals(System, other.System, StringComparison.Ordinal) && string.Equals(Code, other.Code, StringComparison.Ordinal);

    /// <inheritdoc />
    public override int GetHashCode() => HashCode.Combine(System, Code);
}
