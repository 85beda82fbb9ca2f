using CdsNatremia.Core.Cards;

namespace CdsNatremia.Core.Engine;

/// <summary>A rule that can produce whole cards (the assessment card, a correction-rate card, a drug-order warning).</summary>
public interface ICardProducer
{
    /// <summary>
    /// A stable id for audit and feedback reports, e.g. "sodium.assessment". Hook definitions name the producers that run
    /// on them by this id (<see cref="HookDefinition.Producers"/>).
    /// </summary>
    string RuleId { get; }

    /// <summary>Produces zero or more cards. Must be pure: same context, same cards.</summary>
    IEnumerable<Card> Produce(DecisionContext context);
}
