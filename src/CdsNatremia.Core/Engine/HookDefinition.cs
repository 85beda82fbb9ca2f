namespace CdsNatremia.Core.Engine;

/// <summary>Which draft orders of the hook context a hook's cards speak about (<see cref="CorrectionRate.DraftOrders"/>).</summary>
public enum DraftOrderScope
{
    /// <summary>The hook carries no draft orders.</summary>
    None,

    /// <summary>Every draft order in the context (order-sign: all of them are about to be signed).</summary>
    All,

    /// <summary>Only the draft orders the context's selections field names (order-select).</summary>
    Selected,
}

/// <summary>
/// Everything about one hook in one place: the CDS service that answers it (id, title, description for discovery), its
/// context table, the prefetch it declares, which card producers run on it, which draft orders count and where the
/// context carries its own data. Pure data; the host builds discovery, request checks and the decision request from it
/// (<see cref="HookDefinitions"/> holds the table; DEVELOPERS.md, "Adding a hook").
/// </summary>
public sealed record HookDefinition
{
    /// <summary>The hook kind the engine understands.</summary>
    public required HookKind Kind { get; init; }

    /// <summary>
    /// The hook name as the EHR sends it, e.g. "patient-view". For an organisation-specific hook
    /// (<see cref="OrganisationSpecific"/>) only its noun-verb part; the host puts its configured domain in front.
    /// </summary>
    public required string Hook { get; init; }

    /// <summary>True when the hook name is "{domain}.{Hook}" with the organisation's domain from configuration.</summary>
    public bool OrganisationSpecific { get; init; }

    /// <summary>The CDS service id that answers the hook (the URL segment under /cds-services).</summary>
    public required string ServiceId { get; init; }

    /// <summary>The service title for discovery.</summary>
    public required string Title { get; init; }

    /// <summary>The service description for discovery.</summary>
    public required string Description { get; init; }

    /// <summary>The hook's context fields: name, whether required, JSON shape.</summary>
    public required IReadOnlyList<ContextField> Context { get; init; }

    /// <summary>Prefetch keys the service declares, each with its template in <see cref="PrefetchKeys.Templates"/>.</summary>
    public required IReadOnlyList<string> Prefetch { get; init; }

    /// <summary>Prefetch keys without which the service cannot advise: missing and not obtainable → HTTP 412.</summary>
    public required IReadOnlyList<string> RequiredPrefetch { get; init; }

    /// <summary>The card producers that run on this hook, by <see cref="ICardProducer.RuleId"/> (they run in registration order).</summary>
    public required IReadOnlyList<string> Producers { get; init; }

    /// <summary>Which draft orders the hook's cards speak about.</summary>
    public DraftOrderScope DraftOrders { get; init; } = DraftOrderScope.None;

    /// <summary>The context field (a Bundle) that carries the draft orders, when the hook has them.</summary>
    public string? DraftOrdersField { get; init; }

    /// <summary>The context field (references) naming the selected draft orders, when <see cref="DraftOrders"/> is <see cref="DraftOrderScope.Selected"/>.</summary>
    public string? SelectionsField { get; init; }

    /// <summary>
    /// The context field (a Bundle) that carries newly arrived results, when the hook has one. Its resources' ids become
    /// <see cref="DecisionRequest.NewResultIds"/>, and when the required prefetch cannot be had the hook answers from a
    /// sodium among them (saying which checks the missing history leaves undone) instead of refusing with 412.
    /// </summary>
    public string? ArrivedResultsField { get; init; }

    /// <summary>
    /// True for a routine chart opening: a card offers at most <see cref="Cards.SuggestionPolicy.MaxOnChartOpening"/>
    /// suggestions, and advice a clinician already answered does not interrupt again (docs/audit.md).
    /// </summary>
    public bool ChartOpening { get; init; }

    /// <summary>The hook name as sent, with <paramref name="domain"/> in front for an organisation-specific hook.</summary>
    public string NameIn(string domain) => OrganisationSpecific ? domain + "." + Hook : Hook;

    /// <summary>True when <paramref name="producer"/> runs on this hook.</summary>
    public bool Runs(ICardProducer producer)
        => Producers.Contains(Guard.NotNull(producer, nameof(producer)).RuleId, StringComparer.Ordinal);
}
