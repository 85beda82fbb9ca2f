namespace CdsNatremia.Cli.Replay;

/// <summary>The outcome of comparing one manifest field.</summary>
internal enum FieldResult
{
    /// <summary>The answer shows what the manifest expects.</summary>
    Pass,

    /// <summary>The answer differs, or the field could not be compared (a replay that passes has compared every field).</summary>
    Fail,

    /// <summary>
    /// Nothing to compare, by design: the field describes a card's content and the manifest expects no card (and none
    /// came), or the field is prose for a person (<c>clinicianExpects</c>).
    /// </summary>
    NotApplicable,
}
