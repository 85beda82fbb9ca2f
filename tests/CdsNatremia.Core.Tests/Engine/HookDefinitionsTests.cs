using System.Text.RegularExpressions;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Knowledge;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.Engine;

/// <summary>
/// Every hook's one definition is consistent: its producers exist, its prefetch keys have templates whose tokens name
/// its own context fields, and the fields it gives a part (draft orders, selections, arrived results) are in its
/// context table with the right shape. The engine runs exactly the producers a definition names.
/// </summary>
public partial class HookDefinitionsTests
{
    public static TheoryData<HookKind> Kinds() => [.. Enum.GetValues<HookKind>()];

    [Theory]
    [MemberData(nameof(Kinds))]
    public void Of_EveryHookKind_HasExactlyOneDefinition(HookKind kind)
    {
        Assert.Single(HookDefinitions.All, h => h.Kind == kind);
        Assert.Equal(kind, HookDefinitions.Of(kind).Kind);
    }

    [Fact]
    public void All_ServiceIdsAndHookNames_AreUnique()
    {
        Assert.Equal(HookDefinitions.All.Count, HookDefinitions.All.Select(h => h.ServiceId).Distinct(StringComparer.Ordinal).Count());
        Assert.Equal(HookDefinitions.All.Count, HookDefinitions.All.Select(h => h.NameIn("org.example")).Distinct(StringComparer.Ordinal).Count());
    }

    [Fact]
    public void All_EveryNamedProducer_IsRegistered()
    {
        var registered = CardProducers.Default().Select(p => p.RuleId).ToHashSet(StringComparer.Ordinal);
        foreach (var hook in HookDefinitions.All)
        {
            Assert.NotEmpty(hook.Producers);
            Assert.All(hook.Producers, id => Assert.True(registered.Contains(id), $"{hook.Hook} names producer '{id}', which CardProducers.Default() does not register."));
        }
    }

    [Fact]
    public void CardProducers_EveryRegisteredProducer_RunsOnSomeHook()
    {
        foreach (var producer in CardProducers.Default())
        {
            Assert.True(HookDefinitions.All.Any(h => h.Runs(producer)), $"No hook runs producer '{producer.RuleId}'.");
        }
    }

    [Fact]
    public void All_EveryPrefetchKey_HasATemplateOfTypeAndQuery()
    {
        foreach (var hook in HookDefinitions.All)
        {
            Assert.NotEmpty(hook.Prefetch);
            Assert.Subset(hook.Prefetch.ToHashSet(StringComparer.Ordinal), hook.RequiredPrefetch.ToHashSet(StringComparer.Ordinal));
            foreach (var key in hook.Prefetch)
            {
                Assert.True(PrefetchKeys.Templates.TryGetValue(key, out var template), $"{hook.Hook}: prefetch key '{key}' has no template.");
                // CDS Hooks 2.0 prefetch templates are FHIR read or search URLs relative to the FHIR base: Type/id or Type?query.
                Assert.Matches(TemplateShape(), template);
            }
        }
    }

    [Fact]
    public void All_EveryTemplateToken_NamesARequiredFieldOfTheHooksContext()
    {
        foreach (var hook in HookDefinitions.All)
        {
            foreach (var key in hook.Prefetch)
            {
                foreach (Match token in Token().Matches(PrefetchKeys.Templates[key]))
                {
                    // A token the context might not carry would leave the query unfilled (CDS Hooks 2.0, prefetch tokens).
                    var name = token.Groups[1].Value;
                    Assert.Contains(hook.Context, f => f.Name == name && f.Required);
                }
            }
        }
    }

    [Theory]
    [MemberData(nameof(Kinds))]
    public void Of_ContextFieldsGivenAPart_AreInTheContextTableWithTheirShape(HookKind kind)
    {
        var hook = HookDefinitions.Of(kind);
        Assert.Contains(hook.Context, f => f.Name == "patientId" && f.Required && f.Kind == ContextFieldKind.FhirId);
        Assert.Equal(hook.Context.Count, hook.Context.Select(f => f.Name).Distinct(StringComparer.Ordinal).Count());
        AssertField(hook, hook.DraftOrdersField, ContextFieldKind.Bundle);
        AssertField(hook, hook.SelectionsField, ContextFieldKind.ReferenceArray);
        AssertField(hook, hook.ArrivedResultsField, ContextFieldKind.Bundle);
        Assert.Equal(hook.DraftOrders != DraftOrderScope.None, hook.DraftOrdersField is not null);
        Assert.Equal(hook.DraftOrders == DraftOrderScope.Selected, hook.SelectionsField is not null);

        // The host reads only the Bundle fields a definition gives a part; any other Bundle would be checked and then ignored.
        Assert.All(
            hook.Context.Where(f => f.Kind == ContextFieldKind.Bundle),
            f => Assert.True(f.Name == hook.DraftOrdersField || f.Name == hook.ArrivedResultsField, $"{hook.Hook}: context Bundle '{f.Name}' has no part."));
    }

    [Theory]
    [InlineData(HookKind.PatientView, new[] { "sodium.assessment", "sodium.correction-rate" })]
    [InlineData(HookKind.ResultArrive, new[] { "sodium.assessment", "sodium.correction-rate" })]
    [InlineData(HookKind.OrderSelect, new[] { "drug.order-warning" })]
    [InlineData(HookKind.OrderSign, new[] { "drug.order-warning" })]
    public void Decide_Hook_RunsOnlyTheProducersItsDefinitionNames(HookKind kind, string[] expectedAmong)
    {
        var stubs = new[] { "sodium.assessment", "sodium.correction-rate", "drug.order-warning" }.Select(id => new RecordingProducer(id)).ToList();
        new DecisionEngine(stubs, new RuleOptions(), KnowledgeBase.Empty).Decide(Some.Request(Some.Facts(Some.Sodium(125)), kind));
        Assert.Equal(expectedAmong, stubs.Where(s => s.Ran).Select(s => s.RuleId));
    }

    private static void AssertField(HookDefinition hook, string? name, ContextFieldKind kind)
    {
        if (name is not null)
        {
            Assert.Contains(hook.Context, f => f.Name == name && f.Kind == kind && f.Required);
        }
    }

    [GeneratedRegex(@"^[A-Z][A-Za-z]+(/\{\{context\.[A-Za-z]+\}\}|\?[A-Za-z_\-]+=[^&\s]+(&[A-Za-z_\-:]+=[^&\s]+)*)$")]
    private static partial Regex TemplateShape();

    [GeneratedRegex(@"\{\{context\.([A-Za-z]+)\}\}")]
    private static partial Regex Token();

    private sealed class RecordingProducer(string ruleId) : ICardProducer
    {
        public string RuleId { get; } = ruleId;

        public bool Ran { get; private set; }

        public IEnumerable<Card> Produce(DecisionContext context)
        {
            Ran = true;
            return [];
        }
    }
}
