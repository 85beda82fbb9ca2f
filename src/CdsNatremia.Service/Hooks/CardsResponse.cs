using System.Buffers;
using System.Text.Json;
using System.Text.Json.Nodes;
using CdsNatremia.Core.Cards;
using CdsNatremia.Fhir.Writing;
using Microsoft.AspNetCore.Http.Json;
using Microsoft.AspNetCore.Http.Metadata;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Service.Hooks;

/// <summary>The coding of a card's topic, as the response sends it (system and display only when known).</summary>
public sealed record TopicCoding(string? System, string Code, string? Display);

/// <summary>One card as answered: the card, the ids given to it and its suggestions, its topic coding and its links.</summary>
public sealed record AnsweredCard(Card Card, Guid Uuid, IReadOnlyList<Guid> SuggestionUuids, TopicCoding Topic, JsonObject? CourseLink, string? ReportUrl);

/// <summary>
/// The CDS Hooks 2.0 response body (<c>{"cards": [...]}</c>), written with a <see cref="Utf8JsonWriter"/> straight to the
/// response body: no document tree is built first. Property order and omissions follow the standard's Card, Suggestion,
/// Action and Link; optional fields with no value are left out.
/// </summary>
public sealed class CardsResponse : IResult, IStatusCodeHttpResult, IContentTypeHttpResult, IEndpointMetadataProvider
{
    private readonly IReadOnlyList<AnsweredCard> _cards;
    private readonly string _sourceLabel;
    private readonly string _patientId;
    private readonly DateTimeOffset _now;

    public CardsResponse(IReadOnlyList<AnsweredCard> cards, string sourceLabel, string patientId, DateTimeOffset now)
    {
        _cards = cards;
        _sourceLabel = sourceLabel;
        _patientId = patientId;
        _now = now;
    }

    /// <summary>The cards, in the order sent.</summary>
    public IReadOnlyList<AnsweredCard> Cards => _cards;

    /// <inheritdoc />
    public int? StatusCode => StatusCodes.Status200OK;

    /// <inheritdoc />
    public string ContentType => "application/json; charset=utf-8";

    /// <inheritdoc />
    public async Task ExecuteAsync(HttpContext httpContext)
    {
        ArgumentNullException.ThrowIfNull(httpContext);
        var response = httpContext.Response;
        response.StatusCode = StatusCodes.Status200OK;
        response.ContentType = ContentType;
        var encoder = httpContext.RequestServices.GetService<IOptions<JsonOptions>>()?.Value.SerializerOptions.Encoder;
        using (var writer = new Utf8JsonWriter(response.BodyWriter, new JsonWriterOptions { Encoder = encoder }))
        {
            WriteTo(writer);
        }

        await response.BodyWriter.FlushAsync(httpContext.RequestAborted).ConfigureAwait(false);
    }

    /// <summary>The body as UTF-8 JSON bytes (tests, tools and benchmarks).</summary>
    public byte[] ToUtf8Bytes(JsonWriterOptions options = default)
    {
        var buffer = new ArrayBufferWriter<byte>();
        using (var writer = new Utf8JsonWriter(buffer, options))
        {
            WriteTo(writer);
        }

        return buffer.WrittenSpan.ToArray();
    }

    /// <summary>Writes the body; the caller flushes.</summary>
    public void WriteTo(Utf8JsonWriter writer)
    {
        ArgumentNullException.ThrowIfNull(writer);
        writer.WriteStartObject();
        writer.WriteStartArray("cards");
        foreach (var answered in _cards)
        {
            WriteCard(writer, answered);
        }

        writer.WriteEndArray();
        writer.WriteEndObject();
    }

    private void WriteCard(Utf8JsonWriter writer, AnsweredCard answered)
    {
        var card = answered.Card;
        writer.WriteStartObject();
        writer.WriteString("uuid", answered.Uuid.ToString());
        writer.WriteString("summary", Summary.Fit(card.Summary));
        writer.WriteString("indicator", Indicator(card.Indicator));
        writer.WriteString("detail", card.Detail);
        writer.WriteStartObject("source");
        writer.WriteString("label", _sourceLabel);
        writer.WriteStartObject("topic");
        if (answered.Topic.System is { } system)
        {
            writer.WriteString("system", system);
        }

        writer.WriteString("code", answered.Topic.Code);
        if (answered.Topic.Display is { } display)
        {
            writer.WriteString("display", display);
        }

        writer.WriteEndObject();
        writer.WriteEndObject();

        if (card.Suggestions.Count > 0)
        {
            writer.WriteStartArray("suggestions");
            for (var i = 0; i < card.Suggestions.Count; i++)
            {
                WriteSuggestion(writer, card.Suggestions[i], answered.SuggestionUuids[i]);
            }

            writer.WriteEndArray();
            writer.WriteString("selectionBehavior", card.SelectionBehavior == SelectionBehavior.AtMostOne ? "at-most-one" : "any");
        }

        // Links: the sodium-course view (a SMART app) when configured, then the card's full report.
        if (answered.CourseLink is not null || answered.ReportUrl is not null)
        {
            writer.WriteStartArray("links");
            answered.CourseLink?.WriteTo(writer);
            if (answered.ReportUrl is { } url)
            {
                writer.WriteStartObject();
                writer.WriteString("label", CardResponseWriter.ReportLinkLabel);
                writer.WriteString("url", url);
                writer.WriteString("type", "absolute");
                writer.WriteEndObject();
            }

            writer.WriteEndArray();
        }

        if (card.Content is { } content)
        {
            writer.WriteStartObject("extension");
            writer.WriteStartObject(CardResponseWriter.FindingsExtension);
            writer.WriteStartArray("findings");
            foreach (var finding in content.All())
            {
                FindingJson.Write(writer, finding);
            }

            writer.WriteEndArray();
            writer.WriteString("report", card.Report);
            writer.WriteEndObject();
            writer.WriteEndObject();
        }

        if (card.OverrideReasons.Count > 0)
        {
            writer.WriteStartArray("overrideReasons");
            foreach (var reason in card.OverrideReasons)
            {
                writer.WriteStartObject();
                writer.WriteString("system", reason.System);
                writer.WriteString("code", reason.Code);
                writer.WriteString("display", reason.Display ?? reason.Code);
                writer.WriteEndObject();
            }

            writer.WriteEndArray();
        }

        writer.WriteEndObject();
    }

    private void WriteSuggestion(Utf8JsonWriter writer, Suggestion suggestion, Guid uuid)
    {
        writer.WriteStartObject();
        writer.WriteString("label", suggestion.Label);
        writer.WriteString("uuid", uuid.ToString());
        if (suggestion.IsRecommended is { } recommended)
        {
            writer.WriteBoolean("isRecommended", recommended);
        }

        if (suggestion.Actions.Count > 0)
        {
            writer.WriteStartArray("actions");
            foreach (var action in suggestion.Actions)
            {
                writer.WriteStartObject();
                writer.WriteString("type", action.Kind switch { ActionKind.Create => "create", ActionKind.Update => "update", _ => "delete" });
                writer.WriteString("description", action.Description);
                if (action.Create is { } proposal)
                {
                    // Firely's JSON of the order, re-read so the response's encoder writes it like every other value.
                    writer.WritePropertyName("resource");
                    JsonNode.Parse(OrderResourceFactory.ToJson(OrderResourceFactory.LabOrder(proposal, _patientId, _now)))!.WriteTo(writer);
                }

                if (action.ResourceId is { } resourceId)
                {
                    writer.WriteString("resourceId", resourceId);
                }

                writer.WriteEndObject();
            }

            writer.WriteEndArray();
        }

        writer.WriteEndObject();
    }

    private static string Indicator(CardIndicator indicator) => indicator switch
    {
        CardIndicator.Critical => "critical",
        CardIndicator.Warning => "warning",
        _ => "info",
    };

    /// <inheritdoc />
    public static void PopulateMetadata(System.Reflection.MethodInfo method, EndpointBuilder builder)
    {
        ArgumentNullException.ThrowIfNull(builder);
        builder.Metadata.Add(new ProducesResponseTypeMetadata(StatusCodes.Status200OK, typeof(JsonObject), ["application/json"]));
    }
}
