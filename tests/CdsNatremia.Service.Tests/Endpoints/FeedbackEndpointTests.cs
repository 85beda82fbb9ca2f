using System.Net;
using System.Text.Json.Nodes;
using CdsNatremia.Audit.Records;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Endpoints;

/// <summary>POST /cds-services/{id}/feedback (CDS Hooks 2.0 "Feedback") against real issued cards.</summary>
public sealed class FeedbackEndpointTests(NatremiaFactory factory) : IClassFixture<NatremiaFactory>
{
    private DateTimeOffset Now => factory.Clock.GetUtcNow();

    [Fact]
    public async Task Accepted_SentTwice_200EmptyBodyAndStoredOnce()
    {
        var client = factory.CreateClient();
        var card = (await FeedbackCalls.IssueAsync(client))[0]!;
        var body = FeedbackCalls.Body(FeedbackCalls.Accepted(card, Now.AddMinutes(-1)));

        var first = await FeedbackCalls.PostAsync(client, body);
        var second = await FeedbackCalls.PostAsync(client, body);

        Assert.Equal(HttpStatusCode.OK, first.StatusCode);
        Assert.Equal(HttpStatusCode.OK, second.StatusCode);
        Assert.Equal(string.Empty, await first.Content.ReadAsStringAsync()); // the standard defines no response body
        var stored = Assert.Single(await FeedbackCalls.Store(factory).FindFeedbackAsync(Guid.Parse((string)card["uuid"]!), CancellationToken.None));
        Assert.Equal(FeedbackOutcome.Accepted, stored.Outcome);
        Assert.Equal(Guid.Parse((string)card["suggestions"]![0]!["uuid"]!), Assert.Single(stored.AcceptedSuggestions));
    }

    [Fact]
    public async Task Overridden_WithReasonAndComment_Stored()
    {
        var client = factory.CreateClient();
        var uuid = (string)(await FeedbackCalls.IssueAsync(client))[0]!["uuid"]!;
        var entry = FeedbackCalls.Overridden(uuid, Now);
        entry["overrideReason"]!["userComment"] = "Sodium rechecked this morning.";

        Assert.Equal(HttpStatusCode.OK, (await FeedbackCalls.PostAsync(client, FeedbackCalls.Body(entry))).StatusCode);

        var stored = Assert.Single(await FeedbackCalls.Store(factory).FindFeedbackAsync(Guid.Parse(uuid), CancellationToken.None));
        Assert.Equal("benefit-outweighs-risk", stored.OverrideReason?.Code);
        Assert.Equal("Sodium rechecked this morning.", stored.UserComment);
    }

    [Fact]
    public async Task UnknownCard_404NamingTheCard()
    {
        var unknown = Guid.NewGuid().ToString();
        var response = await FeedbackCalls.PostAsync(factory.CreateClient(), FeedbackCalls.Body(FeedbackCalls.Overridden(unknown, Now)));
        Assert.Equal(HttpStatusCode.NotFound, response.StatusCode);
        Assert.Contains(unknown, await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task GoodEntryWithUnknownCard_404AndGoodEntryNotStored()
    {
        var client = factory.CreateClient();
        var uuid = (string)(await FeedbackCalls.IssueAsync(client))[0]!["uuid"]!;
        var body = FeedbackCalls.Body(FeedbackCalls.Overridden(uuid, Now), FeedbackCalls.Overridden(Guid.NewGuid().ToString(), Now));

        Assert.Equal(HttpStatusCode.NotFound, (await FeedbackCalls.PostAsync(client, body)).StatusCode);
        Assert.Empty(await FeedbackCalls.Store(factory).FindFeedbackAsync(Guid.Parse(uuid), CancellationToken.None));
    }

    [Fact]
    public async Task CardOfAnotherService_422()
    {
        var client = factory.CreateClient();
        var uuid = (string)(await FeedbackCalls.IssueAsync(client))[0]!["uuid"]!; // issued by natremia-chart-review
        var response = await FeedbackCalls.PostAsync(client, FeedbackCalls.Body(FeedbackCalls.Overridden(uuid, Now)), "natremia-order-sign");
        Assert.Equal(HttpStatusCode.UnprocessableEntity, response.StatusCode);
        Assert.Contains("another CDS service", await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task SuggestionOfAnotherCard_422()
    {
        var client = factory.CreateClient();
        var card = (await FeedbackCalls.IssueAsync(client))[0]!;
        var other = (await FeedbackCalls.IssueAsync(client))[0]!;
        var entry = FeedbackCalls.Accepted(card, Now);
        entry["acceptedSuggestions"]![0]!["id"] = (string)other["suggestions"]![0]!["uuid"]!;

        Assert.Equal(HttpStatusCode.UnprocessableEntity, (await FeedbackCalls.PostAsync(client, FeedbackCalls.Body(entry))).StatusCode);
    }

    [Theory]
    [InlineData("{\"feedback\": [", "not valid JSON")]
    [InlineData("{\"feedback\": []}", "at least one entry")]
    [InlineData("{\"feedback\": [{\"card\": \"4e0a3a1e-3283-4575-ab82-028d55fe2719\", \"outcomeTimestamp\": \"2026-03-10T11:00:00Z\"}]}", "'feedback[0].outcome' is required")]
    [InlineData("{\"feedback\": [{\"card\": \"4e0a3a1e-3283-4575-ab82-028d55fe2719\", \"outcome\": \"accepted\", \"outcomeTimestamp\": \"2026-03-10T11:00:00Z\"}]}", "required when the outcome is 'accepted'")]
    public async Task MalformedBody_400NamingTheProblem(string body, string message)
    {
        var response = await HookCalls.PostRawAsync(factory.CreateClient(), FeedbackCalls.ChartReview + "/feedback", body);
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Contains(message, await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task NotJson_415()
        => Assert.Equal(HttpStatusCode.UnsupportedMediaType, (await HookCalls.PostRawAsync(factory.CreateClient(), FeedbackCalls.ChartReview + "/feedback", "feedback", "text/plain")).StatusCode);

    [Fact]
    public async Task UnknownService_404()
        => Assert.Equal(HttpStatusCode.NotFound, (await FeedbackCalls.PostAsync(factory.CreateClient(), FeedbackCalls.Body(FeedbackCalls.Overridden(Guid.NewGuid().ToString(), Now)), "no-such-service")).StatusCode);

    [Fact]
    public async Task DeeplyNestedBody_400()
    {
        var body = new string('[', 200) + new string(']', 200);
        Assert.Equal(HttpStatusCode.BadRequest, (await HookCalls.PostRawAsync(factory.CreateClient(), FeedbackCalls.ChartReview + "/feedback", body)).StatusCode);
    }
}
