using System.Text.Json;
using CdsNatremia.Core.Engine;
using CdsNatremia.Service.Fetching;
using CdsNatremia.Service.Hooks;

namespace CdsNatremia.Service.Tests.Fetching;

// Token names and meaning: CDS Hooks 2.0, "Prefetch tokens" ({{context.<field>}} for root primitive context fields;
// {{userPractitionerId}} and its siblings from context.userId of that resource type).
public class PrefetchQueryTests
{
    private static JsonElement Context(string json)
    {
        using var document = JsonDocument.Parse(json);
        return document.RootElement.Clone();
    }

    [Fact]
    public void Build_PatientIdToken_Substituted()
    {
        var query = PrefetchQuery.Build(PrefetchKeys.Templates[PrefetchKeys.Patient], Context("""{"patientId":"abc-1"}"""), out var problem);
        Assert.Null(problem);
        Assert.Equal("Patient/abc-1", query);
    }

    [Fact]
    public void Build_ValueWithReservedCharacters_UrlEncodedSoItCannotAddParameters()
    {
        var query = PrefetchQuery.Build("Observation?encounter={{context.encounterId}}&_count=1", Context("""{"encounterId":"e1&patient=other/x"}"""), out _);
        Assert.Equal("Observation?encounter=e1%26patient%3Dother%2Fx&_count=1", query);
    }

    [Theory]
    [InlineData("{{userPractitionerId}}", "Practitioner/pr-9", "pr-9")]
    [InlineData("{{userPractitionerRoleId}}", "PractitionerRole/role-2", "role-2")]
    [InlineData("{{userPatientId}}", "Patient/pt-3", "pt-3")]
    [InlineData("{{userRelatedPersonId}}", "RelatedPerson/rp-4", "rp-4")]
    public void Build_UserTokens_FromUserIdOfThatType(string token, string userId, string expected)
    {
        var query = PrefetchQuery.Build("X?who=" + token, Context($$"""{"userId":"{{userId}}"}"""), out var problem);
        Assert.Null(problem);
        Assert.Equal("X?who=" + expected, query);
    }

    [Fact]
    public void Build_UserTokenOfAnotherType_Unresolved()
    {
        var query = PrefetchQuery.Build("X?who={{userPatientId}}", Context("""{"userId":"Practitioner/pr-9"}"""), out var problem);
        Assert.Null(query);
        Assert.Contains("{{userPatientId}}", problem, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("""{"patientId":"p"}""")] // field absent
    [InlineData("""{"encounterId":{"a":1}}""")] // not primitive
    [InlineData("""{"encounterId":""}""")] // empty
    public void Build_ContextFieldMissingOrNotPrimitive_Unresolved(string context)
    {
        Assert.Null(PrefetchQuery.Build("Encounter/{{context.encounterId}}", Context(context), out var problem));
        Assert.Contains("{{context.encounterId}}", problem, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("Patient/{{context.patientId}}", "Patient", true)]
    [InlineData("Observation?patient={{context.patientId}}&code=x", "Observation", false)]
    [InlineData("Condition?patient=Patient/1", "Condition", false)]
    public void ResourceTypeAndRead_FromTheTemplate(string template, string type, bool read)
    {
        Assert.Equal(type, PrefetchQuery.ResourceTypeOf(template));
        Assert.Equal(read, PrefetchQuery.IsRead(template));
    }
}
