using CdsNatremia.Core.Drugs;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Sodium;

namespace CdsNatremia.Core.Course;

/// <summary>
/// What the sodium-course picture shows, as numbers: the usable sodium results, the bounds and the set-aside items, the
/// severity bands, the correction envelope from the nadir, the implicated drugs' exposure and the fluid and vaptan
/// orders. Pure data; a renderer draws it and writes the same numbers into a table. Times are instants (the renderer
/// shows them in the display zone).
/// </summary>
public sealed record CourseModel
{
    /// <summary>Usable sodium measurements, oldest first.</summary>
    public required IReadOnlyList<CoursePoint> Points { get; init; }

    /// <summary>Sodium values that are bounds (e.g. "below 100"), oldest first: drawn as bounds, never as points.</summary>
    public required IReadOnlyList<CourseBound> Bounds { get; init; }

    /// <summary>Sodium results received but not used, with the reason (another patient's are only counted).</summary>
    public required IReadOnlyList<CourseSetAside> SetAside { get; init; }

    /// <summary>How many received items were about another patient: counted, never shown.</summary>
    public int AboutAnotherPatientCount { get; init; }

    /// <summary>The severity bands, lowest first.</summary>
    public required IReadOnlyList<CourseBand> Bands { get; init; }

    /// <summary>Where the bands come from.</summary>
    public required string BandSource { get; init; }

    /// <summary>The correction envelope from the nadir, or null when there is none (see <see cref="EnvelopeNote"/>).</summary>
    public CorrectionEnvelope? Envelope { get; init; }

    /// <summary>Why there is no envelope, when there is none.</summary>
    public string? EnvelopeNote { get; init; }

    /// <summary>Exposure to the drugs that can lower sodium, as bars.</summary>
    public required IReadOnlyList<DrugExposure> Drugs { get; init; }

    /// <summary>Intravenous sodium chloride and vaptan orders, with the predicted effect where it can be computed.</summary>
    public required IReadOnlyList<CourseOrder> Orders { get; init; }

    /// <summary>The assessment time (the right edge of the picture at the latest).</summary>
    public required DateTimeOffset Now { get; init; }

    /// <summary>Start of the time axis.</summary>
    public required DateTimeOffset From { get; init; }

    /// <summary>End of the time axis.</summary>
    public required DateTimeOffset To { get; init; }
}

/// <summary>One usable sodium measurement.</summary>
/// <param name="At">When the specimen was taken.</param>
/// <param name="Value">Sodium, mmol/L.</param>
/// <param name="Reference">"Observation/{id}".</param>
/// <param name="IsPreliminary">True for a preliminary result.</param>
/// <param name="Band">The severity band of the value.</param>
public sealed record CoursePoint(DateTimeOffset At, double Value, string Reference, bool IsPreliminary, SeverityBand Band);

/// <summary>A sodium reported as a bound.</summary>
/// <param name="At">When the specimen was taken.</param>
/// <param name="Value">The bound, mmol/L.</param>
/// <param name="Comparator">Which side of the bound the real value lies.</param>
/// <param name="Reference">"Observation/{id}".</param>
/// <param name="Description">"below 100", "at or above 150"…</param>
public sealed record CourseBound(DateTimeOffset At, double Value, ValueComparator Comparator, string Reference, string Description)
{
    /// <summary>True when the real value lies below the bound.</summary>
    public bool PointsDown => Comparator is ValueComparator.LessThan or ValueComparator.LessOrEqual;
}

/// <summary>A sodium result received but not used.</summary>
/// <param name="At">Its time, when known.</param>
/// <param name="What">A short description, e.g. "Sodium 131 mg/dL".</param>
/// <param name="Reason">Why it was not used.</param>
/// <param name="Reference">"Observation/{id}" or the prefetch key.</param>
/// <param name="State">Unreadable, superseded or withdrawn.</param>
public sealed record CourseSetAside(DateTimeOffset? At, string What, string Reason, string Reference, FactState State);

/// <summary>A severity band: values from <paramref name="From"/> (inclusive) up to <paramref name="To"/> (exclusive).</summary>
/// <param name="Band">The band.</param>
/// <param name="Name">Its word, e.g. "moderate".</param>
/// <param name="From">Lower edge, mmol/L (the chart's floor for the lowest band).</param>
/// <param name="To">Upper edge, mmol/L.</param>
/// <param name="Range">The band's range for a person, e.g. "125 to below 130 mmol/L".</param>
public sealed record CourseBand(SeverityBand Band, string Name, double From, double To, string Range);

/// <summary>Which line of the correction envelope.</summary>
public enum EnvelopeLineKind
{
    /// <summary>Largest rise in the first 24 h after the nadir.</summary>
    FirstDayLimit,
    /// <summary>Largest rise in the first 48 h after the nadir.</summary>
    TwoDayLimit,
    /// <summary>Largest rise in any 24 h at high risk of osmotic demyelination.</summary>
    HighRiskDayLimit,
    /// <summary>Largest rise in 48 h at high risk.</summary>
    HighRiskTwoDayLimit,
    /// <summary>The smallest useful rise by 24 h after the nadir.</summary>
    MinimumGoal,
}

/// <summary>One horizontal line of the envelope, from one time to another.</summary>
/// <param name="Kind">Which line.</param>
/// <param name="From">Start (the nadir, or 24 h after it for a 48-h line).</param>
/// <param name="To">End.</param>
/// <param name="Rise">The allowed (or wanted) rise, mmol/L.</param>
/// <param name="Value">Nadir + rise, mmol/L: where the line is drawn.</param>
/// <param name="Governs">True when this line is the one that applies to this patient (high-risk lines at high risk).</param>
/// <param name="Label">What the line is, for the legend and the table.</param>
public sealed record EnvelopeLine(EnvelopeLineKind Kind, DateTimeOffset From, DateTimeOffset To, double Rise, double Value, bool Governs, string Label);

/// <summary>The correction envelope from the nadir.</summary>
/// <param name="Nadir">The lowest sodium of the current episode.</param>
/// <param name="HighRisk">True when a high-risk factor was found: the stricter limit applies.</param>
/// <param name="HighRiskFactors">The factors found, in words.</param>
/// <param name="Lines">The lines, standard first.</param>
/// <param name="LimitsName">The limit set's short name.</param>
/// <param name="Source">The limits' citation.</param>
public sealed record CorrectionEnvelope(CoursePoint Nadir, bool HighRisk, IReadOnlyList<string> HighRiskFactors, IReadOnlyList<EnvelopeLine> Lines, string LimitsName, string Source)
{
    /// <summary>The line of a kind, or null.</summary>
    public EnvelopeLine? Line(EnvelopeLineKind kind) => Lines.FirstOrDefault(l => l.Kind == kind);
}

/// <summary>Exposure to one drug that can lower sodium.</summary>
/// <param name="Name">The ingredient, e.g. "hydrochlorothiazide".</param>
/// <param name="Group">The drug group, e.g. "thiazide or thiazide-like diuretic".</param>
/// <param name="Verdict">What its timing says.</param>
/// <param name="VerdictText">The verdict in words.</param>
/// <param name="Start">When use started, when known.</param>
/// <param name="End">When use ended, when known and stopped.</param>
/// <param name="Ongoing">True when the record says it is taken now (or will be).</param>
/// <param name="Reference">The record the verdict rests on.</param>
public sealed record DrugExposure(string Name, string Group, TimingVerdict Verdict, string VerdictText, DateTimeOffset? Start, DateTimeOffset? End, bool Ongoing, string Reference);

/// <summary>What kind of order.</summary>
public enum CourseOrderKind
{
    /// <summary>An intravenous sodium chloride fluid or Ringer's lactate.</summary>
    Fluid,
    /// <summary>A vasopressin-receptor antagonist.</summary>
    Vaptan,
}

/// <summary>A fluid or vaptan order with its predicted effect.</summary>
/// <param name="Kind">Fluid or vaptan.</param>
/// <param name="Name">What it is, e.g. "sodium chloride 3%".</param>
/// <param name="At">When it starts, when known.</param>
/// <param name="Reference">The order.</param>
/// <param name="ChangePerLitre">Predicted change of serum sodium per litre (Adrogué–Madias), mmol/L, rounded to 0.1, when computable.</param>
/// <param name="ChangeForVolume">Predicted change for the ordered volume, mmol/L, rounded to 0.1, when the volume is known.</param>
/// <param name="Effect">The predicted effect in words (or why none is given).</param>
public sealed record CourseOrder(CourseOrderKind Kind, string Name, DateTimeOffset? At, string Reference, double? ChangePerLitre, double? ChangeForVolume, string Effect);
