using System.Text.Json.Nodes;

namespace CdsNatremia.Cli.Prefetch;

/// <summary>What a query selected from a set of resources.</summary>
/// <param name="Matches">Every matching resource, in the order of <c>_sort</c> (all pages).</param>
/// <param name="Included">Resources added by <c>_include</c>.</param>
/// <param name="PageSize">The <c>_count</c> asked for, or null for no limit.</param>
/// <param name="Unsupported">Parameters the evaluator could not apply, each with why; they were ignored.</param>
internal sealed record SearchOutcome(
    IReadOnlyList<JsonObject> Matches,
    IReadOnlyList<JsonObject> Included,
    int? PageSize,
    IReadOnlyList<string> Unsupported);
