using System.Globalization;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Facts;
using Hl7.Fhir.Model;
using Hl7.Fhir.Serialization;

namespace CdsNatremia.Fhir.Writing;

/// <summary>
/// Builds the FHIR resources that suggestion actions carry: a draft ServiceRequest (status draft, intent proposal)
/// coded with LOINC, for the patient in the hook context. The EHR decides whether it becomes a real order.
/// </summary>
public static class OrderResourceFactory
{
    /// <summary>The ServiceRequest for a proposed laboratory test.</summary>
    public static ServiceRequest LabOrder(LabOrderProposal proposal, string patientId, DateTimeOffset now)
    {
        ArgumentNullException.ThrowIfNull(proposal);
        var request = new ServiceRequest
        {
            Status = RequestStatus.Draft,
            Intent = RequestIntent.Proposal,
            Code = new CodeableConcept(CodeSystems.Loinc, proposal.LoincCode, proposal.Display, proposal.Display),
            Subject = new ResourceReference("Patient/" + patientId),
            AuthoredOnElement = new FhirDateTime(now.ToUniversalTime().ToString("yyyy-MM-dd'T'HH:mm:ss'Z'", CultureInfo.InvariantCulture)),
            ReasonCode = [new CodeableConcept { Text = proposal.Reason }],
        };
        if (proposal.WithinHours is { } hours)
        {
            request.Occurrence = new Period
            {
                StartElement = new FhirDateTime(now.ToUniversalTime().ToString("yyyy-MM-dd'T'HH:mm:ss'Z'", CultureInfo.InvariantCulture)),
                EndElement = new FhirDateTime(now.AddHours(hours).ToUniversalTime().ToString("yyyy-MM-dd'T'HH:mm:ss'Z'", CultureInfo.InvariantCulture)),
            };
            request.Note = [new Annotation { Text = "Wanted within " + CdsNatremia.Core.Text.ClinicalDuration.Hours(hours) + "." }];
        }

        return request;
    }

    /// <summary>The resource as compact FHIR JSON.</summary>
    public static string ToJson(Resource resource) => resource.ToJson(pretty: false);
}
