namespace CdsNatremia.Core.Cards;

/// <summary>CDS Hooks suggestion action type.</summary>
public enum ActionKind
{
    /// <summary>create</summary>
    Create,
    /// <summary>update</summary>
    Update,
    /// <summary>delete</summary>
    Delete,
}
