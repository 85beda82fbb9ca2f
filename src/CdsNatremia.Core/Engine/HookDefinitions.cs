namespace CdsNatremia.Core.Engine;

/// <summary>
/// The hooks this service answers, one <see cref="HookDefinition"/> each: the single place a hook is declared.
/// Discovery, the request checks, the decision request and the choice of card producers all read it; adding a hook
/// is a row here (and its <see cref="HookKind"/>) plus its docs (DEVELOPERS.md, "Adding a hook").
/// </summary>
public static class HookDefinitions
{
    /// <summary>The noun-verb part of the organisation-specific result hook (docs/result-hook.md).</summary>
    public const string ResultHookSuffix = "lab-result-arrive";

    // Card producers by RuleId (CardProducers.Default registers them; a test checks every id names one).
    private const string Assessment = "sodium.assessment";
    private const string CorrectionRate = "sodium.correction-rate";
    private const string InfusionPrediction = "sodium.infusion-prediction";
    private const string RateCautionOrder = "sodium.rate-caution-order";
    private const string DrugOrderWarning = "drug.order-warning";

    /// <summary>Every key: what the work-up, the drug reasoning and the correction-rate watch read.</summary>
    private static readonly string[] AllKeys =
    [
        PrefetchKeys.Patient, PrefetchKeys.Sodium, PrefetchKeys.Labs, PrefetchKeys.Weight,
        PrefetchKeys.Conditions, PrefetchKeys.MedicationStatements, PrefetchKeys.MedicationRequests,
    ];

    /// <summary>
    /// Only the sodium series is required: without it there is nothing to assess (412). Everything else is optional;
    /// when it is missing the card says what it could not use (e.g. no Patient → no age or sex for body water).
    /// </summary>
    private static readonly string[] Required = [PrefetchKeys.Sodium];

    private static readonly ContextField UserId = new("userId", true, ContextFieldKind.UserReference);
    private static readonly ContextField PatientId = new("patientId", true, ContextFieldKind.FhirId);
    private static readonly ContextField EncounterId = new("encounterId", false, ContextFieldKind.FhirId);

    /// <summary>patient-view: the chart was opened.</summary>
    public static HookDefinition PatientView { get; } = new()
    {
        Kind = HookKind.PatientView,
        Hook = "patient-view",
        ServiceId = "natremia-chart-review",
        Title = "Low sodium review on chart opening",
        Description = "Assesses the patient's latest sodium: severity, work-up with the data used and what is missing, likely drug causes, and correction-rate safety. No card when sodium is normal.",
        Context = [UserId, PatientId, EncounterId],
        Prefetch = AllKeys,
        RequiredPrefetch = Required,
        Producers = [Assessment, CorrectionRate],
        ChartOpening = true,
    };

    /// <summary>The organisation-specific result hook: new laboratory results arrived (docs/result-hook.md).</summary>
    public static HookDefinition ResultArrive { get; } = new()
    {
        Kind = HookKind.ResultArrive,
        Hook = ResultHookSuffix,
        OrganisationSpecific = true,
        ServiceId = "natremia-result-review",
        Title = "Low sodium review when a laboratory result arrives",
        Description = "Runs when new laboratory results arrive: reassesses a low sodium and watches the correction rate. Organisation-specific hook; see docs/result-hook.md.",
        Context = [UserId with { Required = false }, PatientId, EncounterId, new("results", true, ContextFieldKind.Bundle)],
        Prefetch = AllKeys,
        RequiredPrefetch = Required,
        Producers = [Assessment, CorrectionRate],
        ArrivedResultsField = "results",
    };

    /// <summary>order-select: a prescriber selected orders; only the selected drafts count.</summary>
    public static HookDefinition OrderSelect { get; } = new()
    {
        Kind = HookKind.OrderSelect,
        Hook = "order-select",
        ServiceId = "natremia-order-select",
        Title = "Sodium check on selected orders",
        Description = "When a prescriber selects orders: warns when a selected drug is a likely cause of low sodium, and predicts the sodium change of intravenous sodium chloride orders.",
        Context = [UserId, PatientId, EncounterId, new("selections", true, ContextFieldKind.ReferenceArray), new("draftOrders", true, ContextFieldKind.Bundle)],
        Prefetch = AllKeys,
        RequiredPrefetch = Required,
        Producers = [InfusionPrediction, RateCautionOrder, DrugOrderWarning],
        DraftOrders = DraftOrderScope.Selected,
        DraftOrdersField = "draftOrders",
        SelectionsField = "selections",
    };

    /// <summary>order-sign: a prescriber is about to sign orders; every draft counts.</summary>
    public static HookDefinition OrderSign { get; } = new()
    {
        Kind = HookKind.OrderSign,
        Hook = "order-sign",
        ServiceId = "natremia-order-sign",
        Title = "Sodium check before orders are signed",
        Description = "Before orders are signed: warns when a drug is a likely cause of low sodium, and predicts the sodium change of intravenous sodium chloride orders.",
        Context = [UserId, PatientId, EncounterId, new("draftOrders", true, ContextFieldKind.Bundle)],
        Prefetch = AllKeys,
        RequiredPrefetch = Required,
        Producers = [InfusionPrediction, RateCautionOrder, DrugOrderWarning],
        DraftOrders = DraftOrderScope.All,
        DraftOrdersField = "draftOrders",
    };

    /// <summary>Every hook, in discovery order.</summary>
    public static IReadOnlyList<HookDefinition> All { get; } = [PatientView, ResultArrive, OrderSelect, OrderSign];

    /// <summary>The definition of <paramref name="kind"/>.</summary>
    public static HookDefinition Of(HookKind kind)
        => All.FirstOrDefault(h => h.Kind == kind) ?? throw new ArgumentOutOfRangeException(nameof(kind), kind, "No hook definition for this kind.");
}
