namespace CdsNatremia.Core.Cards;

/// <summary>CDS Hooks selectionBehavior; required whenever a card has suggestions.</summary>
public enum SelectionBehavior
{
    /// <summary>any</summary>
    Any,
    /// <summary>at-most-one</summary>
    AtMostOne,
}
