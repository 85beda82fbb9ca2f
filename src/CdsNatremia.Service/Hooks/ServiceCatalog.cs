using CdsNatremia.Core.Engine;
using CdsNatremia.Service.Configuration;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Service.Hooks;

/// <summary>The services this host offers. Built once from configuration (the result hook's domain is configurable).</summary>
public sealed class ServiceCatalog
{
    /// <summary>The noun-verb part of the organisation-specific result hook.</summary>
    public const string ResultHookSuffix = "lab-result-arrive";

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

    private readonly Dictionary<string, ServiceDefinition> _byId;

    /// <summary>Creates the catalog.</summary>
    public ServiceCatalog(IOptions<NatremiaServiceOptions> options)
    {
        ArgumentNullException.ThrowIfNull(options);
        ResultHook = options.Value.ResultHookDomain + "." + ResultHookSuffix;
        Services =
        [
            new ServiceDefinition
            {
                Id = "natremia-chart-review",
                Hook = "patient-view",
                Kind = HookKind.PatientView,
                Title = "Low sodium review on chart opening",
                Description = "Assesses the patient's latest sodium: severity, work-up with the data used and what is missing, likely drug causes, and correction-rate safety. No card when sodium is normal.",
                Context = [new("userId", true, ContextFieldKind.UserReference), new("patientId", true, ContextFieldKind.FhirId), new("encounterId", false, ContextFieldKind.FhirId)],
                PrefetchKeys = AllKeys,
                RequiredKeys = Required,
            },
            new ServiceDefinition
            {
                Id = "natremia-result-review",
                Hook = ResultHook,
                Kind = HookKind.ResultArrive,
                Title = "Low sodium review when a laboratory result arrives",
                Description = "Runs when new laboratory results arrive: reassesses a low sodium and watches the correction rate. Organisation-specific hook; see docs/result-hook.md.",
                Context =
                [
                    new("userId", false, ContextFieldKind.UserReference), new("patientId", true, ContextFieldKind.FhirId),
                    new("encounterId", false, ContextFieldKind.FhirId), new("results", true, ContextFieldKind.Bundle),
                ],
                PrefetchKeys = AllKeys,
                RequiredKeys = Required,
            },
            new ServiceDefinition
            {
                Id = "natremia-order-select",
                Hook = "order-select",
                Kind = HookKind.OrderSelect,
                Title = "Sodium check on selected orders",
                Description = "When a prescriber selects orders: warns when a selected drug is a likely cause of low sodium, and predicts the sodium change of intravenous sodium chloride orders.",
                Context =
                [
                    new("userId", true, ContextFieldKind.UserReference), new("patientId", true, ContextFieldKind.FhirId), new("encounterId", false, ContextFieldKind.FhirId),
                    new("selections", true, ContextFieldKind.ReferenceArray), new("draftOrders", true, ContextFieldKind.Bundle),
                ],
                PrefetchKeys = AllKeys,
                RequiredKeys = Required,
            },
            new ServiceDefinition
            {
                Id = "natremia-order-sign",
                Hook = "order-sign",
                Kind = HookKind.OrderSign,
                Title = "Sodium check before orders are signed",
                Description = "Before orders are signed: warns when a drug is a likely cause of low sodium, and predicts the sodium change of intravenous sodium chloride orders.",
                Context =
                [
                    new("userId", true, ContextFieldKind.UserReference), new("patientId", true, ContextFieldKind.FhirId),
                    new("encounterId", false, ContextFieldKind.FhirId), new("draftOrders", true, ContextFieldKind.Bundle),
                ],
                PrefetchKeys = AllKeys,
                RequiredKeys = Required,
            },
        ];
        _byId = Services.ToDictionary(s => s.Id, StringComparer.Ordinal);
    }

    /// <summary>The configured result hook name, e.g. "org.example.lab-result-arrive".</summary>
    public string ResultHook { get; }

    /// <summary>All services, in discovery order.</summary>
    public IReadOnlyList<ServiceDefinition> Services { get; }

    /// <summary>The service with this id, or null.</summary>
    public ServiceDefinition? Find(string id) => _byId.GetValueOrDefault(id);
}
