namespace CdsNatremia.Core.Cards;

/// <summary>
/// A laboratory test the card proposes to order. The FHIR layer turns it into a draft ServiceRequest
/// (status draft, intent proposal) coded with LOINC.
/// </summary>
/// <param name="LoincCode">The LOINC code of the test.</param>
/// <param name="Display">The test's name for a person.</param>
/// <param name="Reason">Why the test is proposed, shown as the ServiceRequest's reason text.</param>
/// <param name="WithinHours">When set, the test is wanted within this many hours (occurrence period end).</param>
public sealed record LabOrderProposal(string LoincCode, string Display, string Reason, double? WithinHours = null);
