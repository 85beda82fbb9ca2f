using CdsNatremia.Audit;
using CdsNatremia.Audit.Pseudonyms;
using CdsNatremia.Audit.Storage;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;
using CdsNatremia.Service.Hooks;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Service.Audit;

/// <summary>
/// Advice that is not repeated (docs/audit.md): on a chart opening, a card whose findings fingerprint a clinician already
/// answered for this patient within <see cref="AuditOptions.RepeatQuietHours"/> drops to info and says when it was last
/// reviewed. When the audit store cannot answer, the card is shown unchanged: never silent.
/// </summary>
public sealed class RepeatSuppression
{
    private readonly IAuditStore _store;
    private readonly PatientPseudonymizer _pseudonymizer;
    private readonly DecisionEngine _engine;
    private readonly int _hours;

    /// <summary>Creates the step.</summary>
    public RepeatSuppression(IAuditStore store, PatientPseudonymizer pseudonymizer, DecisionEngine engine, IOptions<AuditOptions> options)
    {
        ArgumentNullException.ThrowIfNull(options);
        _store = store;
        _pseudonymizer = pseudonymizer;
        _engine = engine;
        _hours = options.Value.RepeatQuietHours;
    }

    /// <summary>The cards to send, most urgent first.</summary>
    public async Task<IReadOnlyList<Card>> ApplyAsync(ServiceDefinition service, string patientId, DateTimeOffset now, IReadOnlyList<Card> cards, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(service);
        ArgumentNullException.ThrowIfNull(cards);
        if (_hours <= 0 || cards.Count == 0 || !service.Definition.ChartOpening)
        {
            return cards;
        }

        var pseudonym = _pseudonymizer.Pseudonym(patientId);
        var display = _engine.DisplayAt(now);
        var result = new List<Card>(cards.Count);
        foreach (var card in cards)
        {
            DateTimeOffset? reviewed = null;
            if (!string.IsNullOrEmpty(card.Fingerprint))
            {
                try
                {
                    reviewed = await _store.LastReviewedAsync(pseudonym, card.Fingerprint, now.AddHours(-_hours), cancellationToken).ConfigureAwait(false);
                }
                catch (Exception ex) when (ex is System.Data.Common.DbException or IOException or TimeoutException)
                {
                    reviewed = null; // unknown: the card interrupts as decided
                }
            }

            result.Add(reviewed is { } at ? RepeatedAdvice.Quiet(card, at, display) : card);
        }

        return result.OrderByDescending(c => c.Indicator).ToList();
    }
}
