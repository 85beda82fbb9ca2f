using CdsNatremia.Core.Cards;

namespace CdsNatremia.Service.Hooks;

/// <summary>What handling a hook request came to.</summary>
public abstract record HookOutcome
{
    /// <summary>Cards to return (possibly none).</summary>
    public sealed record Cards(IReadOnlyList<Card> Items, string PatientId, DateTimeOffset Now) : HookOutcome;

    /// <summary>The request was not acceptable (HTTP 400).</summary>
    public sealed record Invalid(IReadOnlyList<string> Problems) : HookOutcome;

    /// <summary>Required data could not be obtained (HTTP 412).</summary>
    public sealed record MissingData(IReadOnlyList<string> Problems) : HookOutcome;
}
