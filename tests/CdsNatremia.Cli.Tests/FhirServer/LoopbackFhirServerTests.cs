using System.Net;
using System.Net.Http.Headers;
using System.Text.Json.Nodes;
using CdsNatremia.Cli.FhirServer;
using CdsNatremia.Cli.Prefetch;
using CdsNatremia.Cli.Tests.Support;
using CdsNatremia.Core.Engine;
using CdsNatremia.Service.Hooks;

namespace CdsNatremia.Cli.Tests.FhirServer;

public class LoopbackFhirServerTests
{
    [Fact]
    public async Task Search_PagesFollowNextLinks_UntilEveryMatchIsSeen()
    {
        await using var server = LoopbackFhirServer.Start(Inputs.Resources("11"), "secret");
        using var client = Client(server, "secret");
        var ids = new List<string>();
        var url = new Uri(server.BaseUrl, "Observation?patient=s11-pt&code=http://loinc.org|2951-2&_sort=-date&_count=2");
        var pages = 0;
        while (url is not null)
        {
            var bundle = JsonNode.Parse(await client.GetStringAsync(url))!;
            Assert.Equal("searchset", (string?)bundle["type"]);
            ids.AddRange(((JsonArray)bundle["entry"]!).Select(e => (string)e!["resource"]!["id"]!));
            var next = ((JsonArray?)bundle["link"])?.FirstOrDefault(l => (string?)l!["relation"] == "next");
            url = next is null ? null : new Uri((string)next["url"]!);
            pages++;
        }

        var expected = Inputs.Ids(FhirSearchEvaluator.Evaluate(FhirQuery.Parse("Observation?patient=s11-pt&code=http://loinc.org|2951-2&_sort=-date"), Inputs.Resources("11")).Matches);
        Assert.Equal(expected, ids);
        Assert.Equal((expected.Count + 1) / 2, pages);
    }

    [Fact]
    public async Task Request_WithoutTheBearerToken_401()
    {
        await using var server = LoopbackFhirServer.Start(Inputs.Resources("01"), "secret");
        using var client = Client(server, "wrong");
        var response = await client.GetAsync(new Uri(server.BaseUrl, "Patient/s01-pt"));
        Assert.Equal(HttpStatusCode.Unauthorized, response.StatusCode);
    }

    [Fact]
    public async Task Read_UnknownId_404AndKnownId_TheResource()
    {
        await using var server = LoopbackFhirServer.Start(Inputs.Resources("01"), "secret");
        using var client = Client(server, "secret");
        Assert.Equal(HttpStatusCode.NotFound, (await client.GetAsync(new Uri(server.BaseUrl, "Patient/nobody"))).StatusCode);
        var patient = JsonNode.Parse(await client.GetStringAsync(new Uri(server.BaseUrl, "Patient/s01-pt")))!;
        Assert.Equal("s01-pt", (string?)patient["id"]);
    }

    [Fact]
    public async Task ServiceTemplates_ServerAnswersWhatPrefetchEvaluationGives()
    {
        // The fetch path must see the same data as prefetch: every template, first page, same resources.
        var resources = Inputs.Resources("04");
        await using var server = LoopbackFhirServer.Start(resources, "secret");
        using var client = Client(server, "secret");
        var context = new JsonObject { ["patientId"] = "s04-pt", ["userId"] = "Practitioner/x" };
        foreach (var (key, template) in PrefetchKeys.Templates)
        {
            var relative = PrefetchTokens.Substitute(template, context);
            var served = JsonNode.Parse(await client.GetStringAsync(new Uri(server.BaseUrl, relative)))!;
            var query = FhirQuery.Parse(relative);
            var outcome = FhirSearchEvaluator.Evaluate(query, resources);
            var expected = query.IsRead ? Inputs.Ids(outcome.Matches) : Inputs.Ids(outcome.Matches.Take(outcome.PageSize ?? int.MaxValue));
            var actual = query.IsRead
                ? [(string)served["id"]!]
                : ((JsonArray?)served["entry"] ?? []).Select(e => (string)e!["resource"]!["id"]!).ToList();
            Assert.True(expected.SequenceEqual(actual), key);
        }
    }

    private static HttpClient Client(LoopbackFhirServer server, string token)
    {
        var client = new HttpClient();
        client.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", token);
        Assert.True(server.BaseUrl.IsLoopback);
        return client;
    }
}
