using CdsNatremia.Service.Fetching;

namespace CdsNatremia.Service.Tests.Fetching;

// The rules under test are this service's token-safety policy (docs/fetching.md); RFC 6750 section 5.3 (bearer
// tokens are only sent over TLS to the server they are meant for) is the reason https is required outside Development.
public class FhirServerAllowlistTests
{
    private const string Listed = "https://ehr.example.org/fhir/";

    [Theory]
    [InlineData("https://ehr.example.org/fhir", true)]
    [InlineData("https://EHR.example.org/fhir/", true)]
    [InlineData("https://ehr.example.org:443/fhir", true)]
    [InlineData("https://ehr.example.org/FHIR", false)] // the path is case-sensitive
    [InlineData("https://ehr.example.org/fhir/other", false)]
    [InlineData("https://ehr.example.org.evil.example/fhir", false)]
    [InlineData("https://ehr.example.org:8443/fhir", false)]
    [InlineData("http://ehr.example.org/fhir", false)] // not https
    [InlineData("https://user:pw@ehr.example.org/fhir", false)]
    [InlineData("https://ehr.example.org/fhir?x=1", false)]
    public void Refusal_OutsideDevelopment_OnlyListedHttpsBases(string server, bool allowed)
    {
        var list = new FhirServerAllowlist([Listed], development: false);
        Assert.Equal(allowed, list.Refusal(new Uri(server)) is null);
    }

    [Fact]
    public void Refusal_HttpOutsideDevelopment_SaysTokenOnlyOverTls()
    {
        var list = new FhirServerAllowlist(["http://ehr.example.org/fhir"], development: false);
        Assert.Contains("not https", list.Refusal(new Uri("http://ehr.example.org/fhir")), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("http://127.0.0.1:8080/fhir", true)]
    [InlineData("http://localhost:8080/fhir", true)]
    [InlineData("http://[::1]:8080/fhir", true)]
    [InlineData("https://ehr.example.org/fhir", false)]
    [InlineData("http://10.0.0.5/fhir", false)]
    public void Refusal_DevelopmentWithEmptyList_LoopbackOnly(string server, bool allowed)
    {
        var list = new FhirServerAllowlist([], development: true);
        Assert.Equal(allowed, list.Refusal(new Uri(server)) is null);
    }

    [Fact]
    public void Refusal_DevelopmentWithAList_OnlyTheList()
    {
        var list = new FhirServerAllowlist([Listed], development: true);
        Assert.NotNull(list.Refusal(new Uri("http://127.0.0.1:8080/fhir")));
        Assert.Null(list.Refusal(new Uri(Listed)));
    }

    [Fact]
    public void Refusal_EmptyListOutsideDevelopment_RefusesEverything()
    {
        var list = new FhirServerAllowlist([], development: false);
        Assert.Contains("no FHIR server is on this service's allowlist", list.Refusal(new Uri("https://127.0.0.1/fhir")), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("https://ehr.example.org/fhir", "https://ehr.example.org/fhir/Observation?page=2", true)]
    [InlineData("https://ehr.example.org/fhir", "https://other.example.org/fhir/Observation?page=2", false)]
    [InlineData("https://ehr.example.org/fhir", "http://ehr.example.org/fhir/Observation?page=2", false)]
    [InlineData("https://ehr.example.org/fhir", "https://ehr.example.org:8443/fhir/Observation", false)]
    public void SameOrigin_SchemeHostAndPortMustMatch(string a, string b, bool same)
        => Assert.Equal(same, FhirServerAllowlist.SameOrigin(new Uri(a), new Uri(b)));
}
