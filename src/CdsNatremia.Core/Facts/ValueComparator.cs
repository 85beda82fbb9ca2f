namespace CdsNatremia.Core.Facts;

/// <summary>The comparator of a bounded quantity (FHIR R4 Quantity.comparator, value set quantity-comparator).</summary>
public enum ValueComparator
{
    /// <summary>&lt;: the real value is below the number.</summary>
    LessThan,
    /// <summary>&lt;=: the real value is at or below the number.</summary>
    LessOrEqual,
    /// <summary>&gt;: the real value is above the number.</summary>
    GreaterThan,
    /// <summary>&gt;=: the real value is at or above the number.</summary>
    GreaterOrEqual,
}
