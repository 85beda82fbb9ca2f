using System.Text.Json;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Sodium;
using CdsNatremia.Fhir.Reading;
using CdsNatremia.Fhir.Tests.Support;

namespace CdsNatremia.Fhir.Tests.Reading;

/// <summary>
/// A hook context resource is a draft order because the host marked it with that part (<see cref="ContextRole"/>),
/// not because of the name of the field it came in; and a context value's problems name the context field.
/// </summary>
public class ContextRoleTests
{
    private const string Request = """
        {"resourceType":"MedicationRequest","id":"draft-1","status":"draft","intent":"order",
         "medicationCodeableConcept":{"text":"citalopram 10 mg tablet"},"subject":{"reference":"Patient/pt-1"},
         "authoredOn":"2026-03-10T11:00:00Z"}
        """;

    private static AssembledFacts Assemble(ContextRole role, string field)
    {
        using var doc = JsonDocument.Parse(Json.Bundle(Request));
        var value = new BundleReader(new ResourceParser()).Read(field, doc.RootElement, DataOrigin.Context);
        var resources = value.Resources.Select(r => r with { Role = role }).ToList();
        return new FactsAssembler(new SodiumReadingOptions()).Assemble(Json.PatientId, Json.Now, [], resources);
    }

    [Fact]
    public void Assemble_ContextRequestMarkedDraftOrder_IsADraftOrder()
    {
        var assembled = Assemble(ContextRole.DraftOrder, "orders");
        Assert.Equal("draft-1", Assert.Single(assembled.DraftOrders).ResourceId);
    }

    [Fact]
    public void Assemble_ContextRequestNamedDraftOrdersButWithoutThePart_NotADraftOrder()
        => Assert.Empty(Assemble(ContextRole.None, "draftOrders").DraftOrders);

    [Fact]
    public void Read_ContextValueWithABadEntry_ProblemNamesTheContextField()
    {
        using var doc = JsonDocument.Parse("""{"resourceType":"Bundle","type":"collection","entry":[{"fullUrl":"x"}]}""");
        var value = new BundleReader(new ResourceParser()).Read("draftOrders", doc.RootElement, DataOrigin.Context);
        Assert.Equal("context 'draftOrders': entry 0 has no resource", Assert.Single(value.Problems));
    }
}
