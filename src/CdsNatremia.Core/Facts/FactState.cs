namespace CdsNatremia.Core.Facts;

/// <summary>
/// What the service knows about one fact it might use. Only <see cref="Usable"/> and <see cref="Bounded"/> carry a
/// value a rule may reason with; only <see cref="Absent"/> (after a real look) may be read as "not present". Every
/// other state makes a conclusion that needs the fact "unknown (could not be read)", never met, not met or normal.
/// </summary>
public enum FactState
{
    /// <summary>Received, readable, this patient's, current: a measurement a rule may use.</summary>
    Usable,

    /// <summary>
    /// A bound rather than a measurement (FHIR Quantity.comparator &lt;, &lt;=, &gt;, &gt;=): a rule may reason with the
    /// side of the bound it knows, never compute a rate or a difference from it.
    /// </summary>
    Bounded,

    /// <summary>Replaced by a later correction of the same result (amended or corrected, same specimen); its correction is used.</summary>
    Superseded,

    /// <summary>Received but set aside: unknown unit, impossible value, unparseable, unresolvable reference.</summary>
    Unreadable,

    /// <summary>About another patient. Counted only: its values, ids and times are never shown and never used.</summary>
    NotThisPatient,

    /// <summary>
    /// Looked for and not there: the data source answered and held nothing (including a result the laboratory withdrew:
    /// cancelled, entered in error, or registered without a value yet).
    /// </summary>
    Absent,
}
