using System.Text.Json;
using CdsNatremia.Fhir.Tests.Support;
using Hl7.Fhir.Serialization;

namespace CdsNatremia.Fhir.Tests.Reading;

/// <summary>
/// Parsing a resource from a request element's own bytes (the fast path BundleReader uses) must accept and refuse
/// exactly what parsing its text does, with the same problem in words: set-aside reasons must not change.
/// </summary>
public class ResourceParserTests
{
    public static TheoryData<string> Resources() => new()
    {
        Json.Observation(),
        Json.Observation(effective: "2026-13-45T08:00:00Z"), // not a FHIR dateTime (FHIR R4 datatypes: month 01–12)
        Json.Observation(value: "\"124\""), // a string where FHIR requires a decimal
        Json.Observation(id: "bad id with spaces"), // FHIR id: letters, digits, '-' and '.' only
        """{"resourceType":"Observation","id":"na-2","status":"final","code":{"text":"Natriämie – Kontrolle"},"unknownElement":1}""",
        """{"resourceType":"NotAResource","id":"x"}""",
        """{"id":"no-type"}""",
        """{"resourceType":"Patient","id":"pt-1","gender":"female","birthDate":"1951-08-14","name":[{"family":"Ødegård","given":["Zoë"]}]}""",
    };

    [Theory]
    [MemberData(nameof(Resources))]
    public void TryParse_ElementAndText_SameOutcome(string json)
    {
        using var document = JsonDocument.Parse(json);
        var parser = new Fhir.Reading.ResourceParser();

        var fromText = parser.TryParse(document.RootElement.GetRawText(), out var textProblem);
        var fromElement = parser.TryParse(document.RootElement, out var elementProblem);

        Assert.Equal(textProblem, elementProblem);
        Assert.Equal(fromText is null, fromElement is null);
        if (fromText is not null)
        {
            Assert.Equal(fromText.ToJson(), fromElement!.ToJson());
        }
    }

    [Fact]
    public void TryParse_Element_ReadsValuesAndNonAsciiTextFromTheBytes()
    {
        using var document = JsonDocument.Parse(
            """{"resourceType":"Observation","id":"na-3","status":"final","code":{"text":"Natriämie – Kontrolle"},"valueQuantity":{"value":124.5,"code":"mmol/L"}}""");
        var resource = new Fhir.Reading.ResourceParser().TryParse(document.RootElement, out var problem);

        var observation = Assert.IsType<Hl7.Fhir.Model.Observation>(resource);
        Assert.Null(problem);
        Assert.Equal("Natriämie – Kontrolle", observation.Code.Text);
        Assert.Equal(124.5m, Assert.IsType<Hl7.Fhir.Model.Quantity>(observation.Value).Value);
    }
}
