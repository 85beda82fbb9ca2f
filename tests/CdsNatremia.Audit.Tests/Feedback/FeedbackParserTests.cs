using System.Text.Json;
using System.Text.Json.Nodes;
using CdsNatremia.Audit.Feedback;
using CdsNatremia.Audit.Records;
using CdsNatremia.Audit.Tests.Support;

namespace CdsNatremia.Audit.Tests.Feedback;

/// <summary>
/// Feedback bodies per CDS Hooks 2.0 (specification, "Feedback": card, outcome accepted|overridden,
/// acceptedSuggestions required for accepted, overrideReason {reason: Coding, userComment}, outcomeTimestamp
/// required; Coding: system and code required).
/// </summary>
public sealed class FeedbackParserTests
{
    private const string Card = "4e0a3a1e-3283-4575-ab82-028d55fe2719";
    private const string Suggestion = "e56e1945-20b3-4393-8503-a1a20fd73152";

    private static JsonObject Accepted() => new()
    {
        ["card"] = Card,
        ["outcome"] = "accepted",
        ["acceptedSuggestions"] = new JsonArray(new JsonObject { ["id"] = Suggestion }),
        ["outcomeTimestamp"] = "2026-03-10T11:58:00Z",
    };

    private static JsonObject Overridden() => new()
    {
        ["card"] = Card,
        ["outcome"] = "overridden",
        ["overrideReason"] = new JsonObject
        {
            ["reason"] = new JsonObject { ["system"] = Some.ReasonSystem, ["code"] = "benefit-outweighs-risk", ["display"] = "Benefit outweighs the risk" },
            ["userComment"] = "Stable on it for years.",
        },
        ["outcomeTimestamp"] = "2026-03-10T11:59:30.250Z",
    };

    private static IReadOnlyList<FeedbackEntry>? Parse(JsonNode body, out IReadOnlyList<string> problems)
    {
        using var document = JsonDocument.Parse(body.ToJsonString());
        return FeedbackParser.Parse(document.RootElement, Some.Now, out problems);
    }

    private static JsonObject Body(params JsonObject[] entries) => new() { ["feedback"] = new JsonArray(entries.Select(e => (JsonNode)e).ToArray()) };

    private static string Refused(JsonNode body)
    {
        Assert.Null(Parse(body, out var problems));
        Assert.NotEmpty(problems);
        return string.Join("\n", problems);
    }

    [Fact]
    public void Parse_SpecificationExamples_BothOutcomesRead()
    {
        var entries = Parse(Body(Accepted(), Overridden()), out var problems);

        Assert.Empty(problems);
        Assert.NotNull(entries);
        Assert.Equal(FeedbackOutcome.Accepted, entries[0].Outcome);
        Assert.Equal(Guid.Parse(Suggestion), Assert.Single(entries[0].AcceptedSuggestions));
        Assert.Equal(new DateTimeOffset(2026, 3, 10, 11, 58, 0, TimeSpan.Zero), entries[0].OutcomeTimestamp);
        Assert.Equal(FeedbackOutcome.Overridden, entries[1].Outcome);
        Assert.Equal(new ReasonCoding(Some.ReasonSystem, "benefit-outweighs-risk", "Benefit outweighs the risk"), entries[1].OverrideReason);
        Assert.Equal("Stable on it for years.", entries[1].UserComment);
        Assert.Equal(250, entries[1].OutcomeTimestamp.Millisecond);
    }

    [Fact]
    public void Parse_OverriddenWithoutReason_Accepted()
    {
        var entry = Overridden();
        entry.Remove("overrideReason");
        var entries = Parse(Body(entry), out _);
        Assert.Null(Assert.Single(entries!).OverrideReason);
    }

    [Fact]
    public void Parse_CommentWithoutCoding_Accepted()
    {
        var entry = Overridden();
        entry["overrideReason"]!.AsObject().Remove("reason");
        var parsed = Assert.Single(Parse(Body(entry), out _)!);
        Assert.Null(parsed.OverrideReason);
        Assert.Equal("Stable on it for years.", parsed.UserComment);
    }

    [Fact]
    public void Parse_OffsetTimestamp_NormalisedToUtc()
    {
        var entry = Accepted();
        entry["outcomeTimestamp"] = "2026-03-10T12:58:00+01:00";
        Assert.Equal(new DateTimeOffset(2026, 3, 10, 11, 58, 0, TimeSpan.Zero), Assert.Single(Parse(Body(entry), out _)!).OutcomeTimestamp);
    }

    [Theory]
    [InlineData("[]", "must be a JSON object")]
    [InlineData("{}", "'feedback' is required")]
    [InlineData("{\"feedback\": {}}", "'feedback' must be an array")]
    [InlineData("{\"feedback\": null}", "'feedback' must be an array")]
    [InlineData("{\"feedback\": []}", "at least one entry")]
    [InlineData("{\"feedback\": [42]}", "'feedback[0]' must be an object")]
    [InlineData("{\"feedback\": [], \"feedbak\": []}", "'feedbak' is not a CDS Hooks feedback field")]
    public void Parse_BadBodyShape_Refused(string json, string message)
        => Assert.Contains(message, Refused(JsonNode.Parse(json)!), StringComparison.Ordinal);

    [Fact]
    public void Parse_MoreThanMaxEntries_Refused()
        => Assert.Contains("at most 100", Refused(Body(Enumerable.Range(0, 101).Select(_ => Accepted()).ToArray())), StringComparison.Ordinal);

    [Theory]
    [InlineData("card", null, "'feedback[0].card' is required")]
    [InlineData("card", "\"not-a-uuid\"", "must be a UUID")]
    [InlineData("card", "\"4e0a3a1e32834575ab82028d55fe2719\"", "must be a UUID")]
    [InlineData("card", "\"urn:uuid:4e0a3a1e-3283-4575-ab82-028d55fe2719\"", "must be a UUID")]
    [InlineData("card", "42", "'feedback[0].card' must be a string")]
    [InlineData("card", "null", "must not be null")]
    [InlineData("card", "\"\"", "must not be empty")]
    [InlineData("outcome", null, "'feedback[0].outcome' is required")]
    [InlineData("outcome", "\"Accepted\"", "must be 'accepted' or 'overridden'")]
    [InlineData("outcome", "\"ignored\"", "must be 'accepted' or 'overridden'")]
    [InlineData("outcome", "true", "'feedback[0].outcome' must be a string")]
    [InlineData("acceptedSuggestions", null, "required when the outcome is 'accepted'")]
    [InlineData("acceptedSuggestions", "[]", "at least one accepted suggestion")]
    [InlineData("acceptedSuggestions", "{\"id\": \"e56e1945-20b3-4393-8503-a1a20fd73152\"}", "must be an array")]
    [InlineData("acceptedSuggestions", "[\"e56e1945-20b3-4393-8503-a1a20fd73152\"]", "must be an object with an 'id'")]
    [InlineData("acceptedSuggestions", "[{}]", "'feedback[0].acceptedSuggestions[0].id' is required")]
    [InlineData("acceptedSuggestions", "[{\"id\": \"x\"}]", "must be a UUID")]
    [InlineData("acceptedSuggestions", "[{\"id\": \"e56e1945-20b3-4393-8503-a1a20fd73152\", \"label\": \"x\"}]", "'feedback[0].acceptedSuggestions[0].label' is not a CDS Hooks feedback field")]
    [InlineData("acceptedSuggestions", "[{\"id\": \"e56e1945-20b3-4393-8503-a1a20fd73152\"}, {\"id\": \"e56e1945-20b3-4393-8503-a1a20fd73152\"}]", "repeats suggestion")]
    [InlineData("overrideReason", "{\"userComment\": \"x\"}", "allowed only when the outcome is 'overridden'")]
    [InlineData("outcomeTimestamp", null, "'feedback[0].outcomeTimestamp' is required")]
    [InlineData("outcomeTimestamp", "\"2026-03-10\"", "ISO 8601 date-time with a time zone")]
    [InlineData("outcomeTimestamp", "\"2026-03-10T11:58:00\"", "ISO 8601 date-time with a time zone")]
    [InlineData("outcomeTimestamp", "\"10/03/2026 11:58\"", "ISO 8601 date-time with a time zone")]
    [InlineData("outcomeTimestamp", "\"2026-02-30T11:58:00Z\"", "ISO 8601 date-time with a time zone")]
    [InlineData("outcomeTimestamp", "\"2026-03-10T12:06:00Z\"", "lies in the future")]
    [InlineData("outcomeTimestamp", "1773143880", "'feedback[0].outcomeTimestamp' must be a string")]
    [InlineData("source", "\"ehr\"", "'feedback[0].source' is not a CDS Hooks feedback field")]
    public void Parse_BadAcceptedField_RefusedNamingTheField(string field, string? json, string message)
    {
        var entry = Accepted();
        entry.Remove(field);
        if (json is not null)
        {
            entry[field] = JsonNode.Parse(json);
        }

        Assert.Contains(message, Refused(Body(entry)), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("acceptedSuggestions", "[{\"id\": \"e56e1945-20b3-4393-8503-a1a20fd73152\"}]", "allowed only when the outcome is 'accepted'")]
    [InlineData("overrideReason", "{}", "must carry 'reason' and/or 'userComment'")]
    [InlineData("overrideReason", "\"benefit-outweighs-risk\"", "must be an object")]
    [InlineData("overrideReason", "{\"reason\": \"benefit-outweighs-risk\"}", "must be a Coding object")]
    [InlineData("overrideReason", "{\"reason\": {\"code\": \"benefit-outweighs-risk\"}}", "'feedback[0].overrideReason.reason.system' is required")]
    [InlineData("overrideReason", "{\"reason\": {\"system\": \"https://cdsnatremia.example.org/fhir/CodeSystem/override-reason\"}}", "'feedback[0].overrideReason.reason.code' is required")]
    [InlineData("overrideReason", "{\"reason\": {\"system\": \"override-reason\", \"code\": \"x\"}}", "must be an absolute URI")]
    [InlineData("overrideReason", "{\"reason\": {\"system\": \"https://cdsnatremia.example.org/fhir/CodeSystem/override-reason\", \"code\": \"two words\"}}", "must not contain spaces")]
    [InlineData("overrideReason", "{\"reason\": {\"system\": \"https://cdsnatremia.example.org/fhir/CodeSystem/override-reason\", \"code\": \"x\", \"display\": null}}", "must not be null")]
    [InlineData("overrideReason", "{\"reason\": {\"system\": \"https://cdsnatremia.example.org/fhir/CodeSystem/override-reason\", \"code\": \"x\", \"version\": \"1\"}}", "'feedback[0].overrideReason.reason.version' is not a CDS Hooks feedback field")]
    [InlineData("overrideReason", "{\"userComment\": 5}", "'feedback[0].overrideReason.userComment' must be a string")]
    [InlineData("overrideReason", "{\"userComment\": \"  \"}", "must not be empty")]
    [InlineData("overrideReason", "{\"comment\": \"x\"}", "'feedback[0].overrideReason.comment' is not a CDS Hooks feedback field")]
    public void Parse_BadOverriddenField_RefusedNamingTheField(string field, string json, string message)
    {
        var entry = Overridden();
        entry[field] = JsonNode.Parse(json);
        Assert.Contains(message, Refused(Body(entry)), StringComparison.Ordinal);
    }

    [Fact]
    public void Parse_CommentTooLong_Refused()
    {
        var entry = Overridden();
        entry["overrideReason"]!["userComment"] = new string('x', FeedbackParser.MaxCommentLength + 1);
        Assert.Contains("longer than 2000 characters", Refused(Body(entry)), StringComparison.Ordinal);
    }

    [Fact]
    public void Parse_OneBadEntryAmongGood_WholeRequestRefusedWithItsIndex()
    {
        var bad = Overridden();
        bad["outcome"] = "dismissed";
        var message = Refused(Body(Accepted(), Overridden(), bad));
        Assert.Contains("'feedback[2].outcome'", message, StringComparison.Ordinal);
        Assert.DoesNotContain("feedback[0]", message, StringComparison.Ordinal);
    }
}
