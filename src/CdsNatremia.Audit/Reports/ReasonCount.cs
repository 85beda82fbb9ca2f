namespace CdsNatremia.Audit.Reports;

/// <summary>How many overridden cards gave one reason.</summary>
/// <param name="System">The reason's code system, or null for "no coded reason given".</param>
/// <param name="Code">The reason code, or null for "no coded reason given".</param>
/// <param name="Display">The display sent with the reason, when any.</param>
/// <param name="Cards">Overridden cards that gave this reason.</param>
public sealed record ReasonCount(string? System, string? Code, string? Display, int Cards);
