using System.Net;
using System.Text.Json.Nodes;
using CdsNatremia.Core.Engine;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Endpoints;

/// <summary>
/// Discovery and the request checks follow each hook's one definition (<see cref="HookDefinitions"/>): every hook is
/// offered with its id, title, description and prefetch templates, and every context field the definition requires is
/// required by the service (400 naming it), while a request carrying the whole context table passes the checks.
/// </summary>
public sealed class HookDefinitionTests(NatremiaFactory factory) : IClassFixture<NatremiaFactory>
{
    public static TheoryData<HookKind> Kinds() => [.. Enum.GetValues<HookKind>()];

    public static TheoryData<HookKind, string> RequiredFields()
    {
        var data = new TheoryData<HookKind, string>();
        foreach (var hook in HookDefinitions.All)
        {
            foreach (var field in hook.Context.Where(f => f.Required))
            {
                data.Add(hook.Kind, field.Name);
            }
        }

        return data;
    }

    [Fact]
    public async Task Discovery_ListsEveryDefinitionInOrderWithItsTemplates()
    {
        var body = JsonNode.Parse(await factory.CreateClient().GetStringAsync("/cds-services"))!;
        var services = body["services"]!.AsArray();
        Assert.Equal(HookDefinitions.All.Select(h => h.ServiceId), services.Select(s => (string)s!["id"]!));
        foreach (var (hook, service) in HookDefinitions.All.Zip(services))
        {
            Assert.Equal(hook.NameIn("org.example"), (string?)service!["hook"]); // the test host's default domain
            Assert.Equal(hook.Title, (string?)service["title"]);
            Assert.Equal(hook.Description, (string?)service["description"]);
            var prefetch = service["prefetch"]!.AsObject();
            Assert.Equal(hook.Prefetch, prefetch.Select(p => p.Key));
            Assert.All(prefetch, p => Assert.Equal(PrefetchKeys.Templates[p.Key], (string?)p.Value));
        }
    }

    [Theory]
    [MemberData(nameof(RequiredFields))]
    public async Task Post_RequiredContextFieldMissing_400NamingIt(HookKind kind, string field)
    {
        var hook = HookDefinitions.Of(kind);
        var body = Body(hook);
        body["context"]!.AsObject().Remove(field);

        var response = await HookCalls.PostAsync(factory.CreateClient(), hook.ServiceId, body);

        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Contains($"'context.{field}' is required by the {hook.NameIn("org.example")} hook.", await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }

    [Theory]
    [MemberData(nameof(Kinds))]
    public async Task Post_WholeContextTable_PassesTheRequestChecks(HookKind kind)
    {
        var hook = HookDefinitions.Of(kind);

        var response = await HookCalls.PostAsync(factory.CreateClient(), hook.ServiceId, Body(hook));

        // No prefetch and no fhirServer: the required sodium cannot be had (412), but the request itself is acceptable.
        Assert.NotEqual(HttpStatusCode.BadRequest, response.StatusCode);
    }

    /// <summary>A request carrying every field of the hook's context table, each in its documented shape.</summary>
    private static JsonObject Body(HookDefinition hook)
    {
        var context = new JsonObject();
        foreach (var field in hook.Context)
        {
            context[field.Name] = field.Kind switch
            {
                ContextFieldKind.FhirId => "hd-pt",
                ContextFieldKind.UserReference => "Practitioner/hd-user",
                ContextFieldKind.Bundle => new JsonObject { ["resourceType"] = "Bundle", ["type"] = "collection", ["entry"] = new JsonArray() },
                ContextFieldKind.ReferenceArray => new JsonArray("MedicationRequest/hd-draft"),
                ContextFieldKind.StringArray => new JsonArray("hd"),
                _ => "hd",
            };
        }

        return new JsonObject
        {
            ["hook"] = hook.NameIn("org.example"),
            ["hookInstance"] = Guid.NewGuid().ToString(),
            ["context"] = context,
        };
    }
}
