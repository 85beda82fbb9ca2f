using System.Text.Json;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Sodium;
using CdsNatremia.Fhir.Reading;

namespace CdsNatremia.Fhir.Tests.Support;

/// <summary>Builds FHIR JSON for tests and reads it through the real FHIR layer.</summary>
internal static class Json
{
    public static readonly DateTimeOffset Now = new(2026, 3, 10, 12, 0, 0, TimeSpan.Zero);

    public const string PatientId = "pt-1";

    public static string Observation(
        string id = "na-1",
        string code = "2951-2",
        string status = "final",
        string value = "124",
        string unit = "mmol/L",
        string effective = "2026-03-10T08:00:00Z",
        string subject = "Patient/pt-1")
        => $$$"""
        {"resourceType":"Observation","id":"{{{id}}}","status":"{{{status}}}",
         "code":{"coding":[{"system":"http://loinc.org","code":"{{{code}}}"}]},
         "subject":{"reference":"{{{subject}}}"},"effectiveDateTime":"{{{effective}}}",
         "valueQuantity":{"value":{{{value}}},"unit":"{{{unit}}}","system":"http://unitsofmeasure.org","code":"{{{unit}}}"}}
        """;

    public static string Bundle(params string[] resources)
        => "{\"resourceType\":\"Bundle\",\"type\":\"searchset\",\"entry\":[" + string.Join(",", resources.Select(r => "{\"resource\":" + r + "}")) + "]}";

    public static PatientFacts Read(string bundleJson)
    {
        using var doc = JsonDocument.Parse(bundleJson);
        var value = new BundleReader(new ResourceParser()).Read("sodium", doc.RootElement, DataOrigin.Prefetch);
        return new FactsAssembler(new SodiumReadingOptions()).Assemble(PatientId, Now, [value], []).Facts;
    }
}
