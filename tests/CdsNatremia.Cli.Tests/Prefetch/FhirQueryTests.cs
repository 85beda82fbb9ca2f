using System.Text.Json.Nodes;
using CdsNatremia.Cli.Prefetch;

namespace CdsNatremia.Cli.Tests.Prefetch;

public class FhirQueryTests
{
    [Fact]
    public void Parse_Read_TypeAndId()
    {
        var query = FhirQuery.Parse("Patient/s01-pt");
        Assert.True(query.IsRead);
        Assert.Equal(("Patient", "s01-pt"), (query.ResourceType, query.ReadId));
    }

    [Fact]
    public void Parse_Search_ParametersDecodedInOrder()
    {
        var query = FhirQuery.Parse("Observation?patient=p1&code=http%3A%2F%2Floinc.org%7C2951-2&_sort=-date");
        Assert.False(query.IsRead);
        Assert.Equal(["patient", "code", "_sort"], query.Parameters.Select(p => p.Key));
        Assert.Equal("http://loinc.org|2951-2", query.Parameters[1].Value);
    }

    [Theory]
    [InlineData("")]
    [InlineData("observation?code=1")]
    [InlineData("Observation?code")]
    [InlineData("Patient/1/extra")]
    public void Parse_NotAQuery_Throws(string text) => Assert.Throws<FormatException>(() => FhirQuery.Parse(text));

    [Fact]
    public void Substitute_ContextAndUserTokens_Replaced()
    {
        // CDS Hooks 2.0 "Prefetch tokens": {{context.x}} and {{userPractitionerId}} derived from context.userId.
        var context = new JsonObject { ["patientId"] = "p 1", ["userId"] = "Practitioner/dr-9" };
        Assert.Equal("Observation?patient=p%201&performer=dr-9",
            PrefetchTokens.Substitute("Observation?patient={{context.patientId}}&performer={{userPractitionerId}}", context));
    }

    [Fact]
    public void Substitute_TokenWithoutValue_Throws()
    {
        var context = new JsonObject { ["patientId"] = "p1", ["userId"] = "Practitioner/dr-9" };
        Assert.Throws<FormatException>(() => PrefetchTokens.Substitute("Encounter/{{context.encounterId}}", context));
        Assert.Throws<FormatException>(() => PrefetchTokens.Substitute("Patient/{{userPatientId}}", context));
    }
}
