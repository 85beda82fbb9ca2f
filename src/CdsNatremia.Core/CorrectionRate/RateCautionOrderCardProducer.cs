using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Knowledge;
using CdsNatremia.Core.Text;

namespace CdsNatremia.Core.CorrectionRate;

/// <summary>
/// On order-select and order-sign, a draft order for a vasopressin-receptor antagonist or for desmopressin gets a
/// warning that it can change sodium quickly, with where the correction stands against the limits. Like the infusion
/// card, it speaks only when the sodium of the current episode was low (or could not be used).
/// </summary>
public sealed class RateCautionOrderCardProducer : ICardProducer
{
    /// <summary>Topic code of the card (card-topic CodeSystem).</summary>
    public const string Topic = "rate-caution-order";

    private static readonly (string SetId, string Why)[] Sets =
    [
        ("drug-vaptan", "A vasopressin-receptor antagonist causes a water diuresis that can raise sodium faster than the correction limits allow, especially with other sodium-raising treatment or when the cause resolves at the same time."),
        ("drug-desmopressin", "Desmopressin reduces water excretion: while it acts it can lower sodium further, and when it wears off or is stopped a water diuresis can raise sodium quickly. Its deliberate use to slow or reverse an over-rapid correction is a senior clinician's decision under local protocol."),
    ];

    /// <inheritdoc />
    public string RuleId => "sodium.rate-caution-order";

    /// <inheritdoc />
    public bool Handles(HookKind hook) => hook is HookKind.OrderSelect or HookKind.OrderSign;

    /// <inheritdoc />
    public IEnumerable<Card> Produce(DecisionContext context)
    {
        Guard.NotNull(context, nameof(context));
        var matches = new List<(Facts.MedicationFact Order, MedicationMatch Match, string Why)>();
        foreach (var order in DraftOrders.Considered(context.Request))
        {
            foreach (var (setId, why) in Sets)
            {
                if (context.Knowledge.Find(setId) is { } set && MedicationMatching.Match(set, order) is { } match)
                {
                    matches.Add((order, match, why));
                }
            }
        }

        var allowance = Allowance.For(context);
        if (matches.Count == 0 || !Allowance.Concerns(context, allowance))
        {
            return [];
        }

        var names = string.Join(", ", matches.Select(m => m.Match.Ingredient).Distinct(StringComparer.OrdinalIgnoreCase));
        var findings = matches
            .Select(m => Invariant.Format($"**{Markdown.Escape(m.Match.Ingredient)}** ({Markdown.Escape(m.Order.Reference)}; matched by {Markdown.Escape(m.Match.By)}; {Markdown.Escape(m.Match.Set.Label)}). {m.Why}"))
            .ToList();
        if (allowance is not null)
        {
            findings.Add("Latest sodium: " + Cite.Result(allowance.Episode.Latest));
        }
        else
        {
            findings.Add("No usable sodium result was found; the correction cannot be placed against the limits.");
        }

        var detail = new DetailWriter()
            .Paragraph(Invariant.Format($"**Order that can change sodium quickly** as of {Invariant.Time(context.Request.Now)}. Advisory only."))
            .Bullets("Findings", findings)
            .Bullets("Where the correction stands (limits)", allowance?.Describe(context.Options.CorrectionRate) ?? [])
            .Bullets("Points clinicians usually weigh (under local protocol; not orders)",
            [
                "Checking sodium often after the first dose, at the interval local protocol sets, and stopping other sodium-raising treatment if the rise approaches the limit.",
                "Discussing the plan with a senior clinician when the patient is at high risk of osmotic demyelination.",
            ]);
        CardFooter.Write(detail, context.Request.Facts, allowance is null ? [] : RateText.Sources(allowance.Limits));

        return
        [
            new Card
            {
                Summary = Summary.Fit(Invariant.Format($"{names} ordered: can change sodium quickly; check sodium often and keep within the correction limits.")),
                Indicator = allowance?.Binding.Status == RateStatus.AtOrPast ? CardIndicator.Critical : CardIndicator.Warning,
                Detail = detail.ToString(),
                Topic = Topic,
                RuleIds = [RuleId],
                ResourcesUsed = matches.Select(m => m.Order.Reference).Distinct(StringComparer.Ordinal).ToList(),
            },
        ];
    }
}
