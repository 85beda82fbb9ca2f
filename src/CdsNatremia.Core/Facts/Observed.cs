using CdsNatremia.Core.Text;
using CdsNatremia.Core.Workup;

namespace CdsNatremia.Core.Facts;

/// <summary>
/// One fact with its <see cref="FactState"/>. The value is reachable only through <see cref="Match{TResult}"/> or
/// <see cref="Judge"/>, each of which makes the caller say what "could not be read" and "absent" mean, so a rule cannot
/// forget the unknown states or read one as met, not met or normal. Immutable; equality is by reference.
/// </summary>
/// <typeparam name="T">The fact, e.g. a <see cref="LabResult"/> or a list of medicines.</typeparam>
public sealed class Observed<T>
    where T : class
{
    private readonly T? _value;

    private Observed(FactState state, T? value, string? reason, string? itemText)
    {
        State = state;
        _value = value;
        Reason = reason;
        ItemText = itemText;
    }

    /// <summary>The state.</summary>
    public FactState State { get; }

    /// <summary>
    /// Why the fact is not usable (set aside, superseded, another patient's) or, for <see cref="FactState.Absent"/>,
    /// what was looked at. Null for usable and bounded facts.
    /// </summary>
    public string? Reason { get; }

    /// <summary>The unreadable item's own text (e.g. a medication's text) so the clinician can find it; never set for another patient's data.</summary>
    public string? ItemText { get; }

    /// <summary>True for the states whose value a rule may reason with (usable, bounded).</summary>
    public bool HasValue => State is FactState.Usable or FactState.Bounded;

    /// <summary>True for the states that make a conclusion "unknown (could not be read)".</summary>
    public bool CouldNotBeRead => State is FactState.Unreadable or FactState.NotThisPatient or FactState.Superseded;

    /// <summary>A usable fact.</summary>
    public static Observed<T> Usable(T value) => new(FactState.Usable, Guard.NotNull(value, nameof(value)), null, null);

    /// <summary>A bound rather than a measurement.</summary>
    public static Observed<T> Bounded(T value) => new(FactState.Bounded, Guard.NotNull(value, nameof(value)), null, null);

    /// <summary>Set aside, with the reason and, when it has one, the item's own text.</summary>
    public static Observed<T> Unreadable(string reason, string? itemText = null) => new(FactState.Unreadable, null, Guard.NotNull(reason, nameof(reason)), itemText);

    /// <summary>Replaced by a correction that could not be used either (the correction itself is normally the usable fact).</summary>
    public static Observed<T> Superseded(string reason) => new(FactState.Superseded, null, Guard.NotNull(reason, nameof(reason)), null);

    /// <summary>Only another patient's data was received: no value, id or time is kept.</summary>
    public static Observed<T> NotThisPatient() => new(FactState.NotThisPatient, null, "the only data received for it was about another patient", null);

    /// <summary>Looked for and not present.</summary>
    public static Observed<T> Absent(string lookedAt) => new(FactState.Absent, null, Guard.NotNull(lookedAt, nameof(lookedAt)), null);

    /// <summary>Answers for every state: the value of a usable or bounded fact, the fact itself when it could not be read, the look when absent.</summary>
    public TResult Match<TResult>(Func<T, TResult> usable, Func<T, TResult> bounded, Func<Observed<T>, TResult> couldNotBeRead, Func<string, TResult> absent)
    {
        Guard.NotNull(usable, nameof(usable));
        Guard.NotNull(bounded, nameof(bounded));
        Guard.NotNull(couldNotBeRead, nameof(couldNotBeRead));
        Guard.NotNull(absent, nameof(absent));
        return State switch
        {
            FactState.Usable => usable(_value!),
            FactState.Bounded => bounded(_value!),
            FactState.Absent => absent(Reason!),
            _ => couldNotBeRead(this),
        };
    }

    /// <summary>
    /// Judges a criterion on this fact. Only a usable fact, or a bound that decides it, gives met or not met; a bound that
    /// does not decide it and an absent fact give <see cref="CriterionStatus.Unknown"/>; every state that could not be read
    /// gives <see cref="CriterionStatus.CouldNotBeRead"/>, whatever <paramref name="isMet"/> would have said.
    /// </summary>
    /// <param name="isMet">The criterion on a measured value.</param>
    /// <param name="boundIsMet">The criterion on a bound: true, false, or null when the bound does not decide it. Null: bounds never decide.</param>
    public CriterionStatus Judge(Func<T, bool> isMet, Func<T, bool?>? boundIsMet = null)
    {
        Guard.NotNull(isMet, nameof(isMet));
        return Match(
            v => isMet(v) ? CriterionStatus.Met : CriterionStatus.NotMet,
            v => boundIsMet?.Invoke(v) switch
            {
                true => CriterionStatus.Met,
                false => CriterionStatus.NotMet,
                null => CriterionStatus.Unknown,
            },
            _ => CriterionStatus.CouldNotBeRead,
            _ => CriterionStatus.Unknown);
    }

    /// <summary>"could not be read: {reason} ("{item text}")", Markdown-escaped as cards print it; null when the fact could be read.</summary>
    public string? CouldNotBeReadText
        => CouldNotBeRead
            ? Rendering.PhraseCatalogue.Default.Render(
                ItemText is { Length: > 0 } text
                    ? Findings.Finding.Of("cite.could-not-be-read.named", Findings.Slot.Text("reason", Reason!), Findings.Slot.Text("text", text))
                    : Findings.Finding.Of("cite.could-not-be-read", Findings.Slot.Text("reason", Reason!)),
                Text.TimeDisplay.Utc(DateTimeOffset.UnixEpoch))
            : null;
}
