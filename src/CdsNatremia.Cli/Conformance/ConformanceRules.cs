namespace CdsNatremia.Cli.Conformance;

/// <summary>The rules checked, each as the CDS Hooks 2.0 specification (HL7, STU2) states it.</summary>
internal static class ConformanceRules
{
    public static readonly IReadOnlyDictionary<string, string> Text = new Dictionary<string, string>(StringComparer.Ordinal)
    {
        ["discovery.status"] = "GET {base}/cds-services answers 200 with a JSON object.",
        ["discovery.services"] = "The discovery response has a 'services' array.",
        ["discovery.service.required"] = "Each service has 'hook', 'description' and 'id' (strings).",
        ["discovery.service.id-unique"] = "Service ids are unique.",
        ["discovery.prefetch.strings"] = "'prefetch' is an object whose values are FHIR query template strings.",
        ["response.status"] = "A service answers a valid request with HTTP 200 and a JSON object.",
        ["response.cards"] = "The response has a 'cards' array (empty when there is no advice).",
        ["response.empty-values"] = "Optional fields with no value are left out: no null, \"\", [] or {} where not allowed.",
        ["card.summary.required"] = "Card 'summary' is required (a string).",
        ["card.summary.length"] = "Card 'summary' is shorter than 140 characters.",
        ["card.indicator.value"] = "Card 'indicator' is required: info, warning or critical.",
        ["card.source.label"] = "Card 'source' is required, with a 'label' string.",
        ["card.uuid.unique"] = "Card and suggestion 'uuid's are unique (feedback names a card by it).",
        ["card.selectionBehavior"] = "'selectionBehavior' (at-most-one or any) is present if and only if the card has suggestions.",
        ["suggestion.label"] = "Each suggestion has a 'label' string.",
        ["action.type"] = "Each action has 'type' create, update or delete.",
        ["action.description"] = "Each action has a 'description' string.",
        ["action.resource"] = "A create or update action carries a FHIR 'resource'.",
        ["action.resourceId"] = "A delete action carries 'resourceId', a relative reference such as 'MedicationRequest/123'.",
        ["coding.system-code"] = "A Coding (source.topic, overrideReasons) has 'system' and 'code'.",
        ["overrideReason.display"] = "Each override reason Coding has a 'display'.",
        ["link.fields"] = "Each link has 'label', 'url' and 'type' (absolute or smart).",
        ["prefetch.412"] = "When required data is neither prefetched nor obtainable from a fhirServer, the service answers 412 Precondition Failed.",
    };

    /// <summary>A violation of a named rule.</summary>
    public static Violation Of(string rule, string where, string found) => new(rule, Text[rule], where, found);
}
