using CdsNatremia.Core.Facts;

namespace CdsNatremia.Core.Findings;

/// <summary>A named value of a finding, e.g. ("sodium", 124 mmol/L).</summary>
public sealed record Slot(string Name, SlotValue Value)
{
    /// <summary>A number printed as used (<see cref="Text.ClinicalNumber.Format"/>).</summary>
    public static Slot Number(string name, double value) => new(name, new NumberValue(value, null));

    /// <summary>A computed result rounded to <paramref name="decimals"/> before it is printed.</summary>
    public static Slot Rounded(string name, double value, int decimals) => new(name, new NumberValue(value, decimals));

    /// <summary>A whole count.</summary>
    public static Slot Count(string name, int value) => new(name, new NumberValue(value, 0));

    /// <summary>A name from data or knowledge (a drug, a band, a code display); Markdown-escaped when printed.</summary>
    public static Slot Text(string name, string value) => new(name, new TextValue(value, Escape: true));

    /// <summary>A name that is already safe Markdown from the knowledge (e.g. a source citation).</summary>
    public static Slot Verbatim(string name, string value) => new(name, new TextValue(value, Escape: false));

    /// <summary>A time, printed in the display zone.</summary>
    public static Slot Time(string name, DateTimeOffset value, TimeStyle style = TimeStyle.Full) => new(name, new TimeValue(value, style));

    /// <summary>A duration in hours: "30 h" up to 72 h, whole days beyond.</summary>
    public static Slot Hours(string name, double hours) => new(name, new DurationValue(hours));

    /// <summary>A laboratory result, cited with value, unit, time, resource and labels.</summary>
    public static Slot Result(string name, LabResult result) => new(name, new ResultValue(result));

    /// <summary>A nested finding, worded by its own phrase.</summary>
    public static Slot Phrase(string name, Finding finding) => new(name, new PhraseValue(finding));

    /// <summary>A list of values, joined with ", " (or <paramref name="separator"/>).</summary>
    public static Slot List(string name, IEnumerable<SlotValue> values, string separator = ", ")
        => new(name, new ListValue([.. values], separator));

    /// <summary>A list of names from data, joined with ", ".</summary>
    public static Slot Names(string name, IEnumerable<string> values)
        => List(name, values.Select(v => (SlotValue)new TextValue(v, Escape: true)));
}

/// <summary>How a time slot prints.</summary>
public enum TimeStyle
{
    /// <summary>"2026-03-10 06:30 UTC" or "2026-03-10 07:30 (UTC+01:00)".</summary>
    Full,

    /// <summary>"10 Mar 07:30" (summaries).</summary>
    Short,

    /// <summary>"3 h ago".</summary>
    Age,

    /// <summary>"3 h ago, 10 Mar 07:30".</summary>
    AgeAndTime,

    /// <summary>"2026-03-10".</summary>
    Day,
}

/// <summary>A typed slot value.</summary>
public abstract record SlotValue;

/// <summary>A number; <see cref="Decimals"/> set when the value is a computed result rounded for display.</summary>
public sealed record NumberValue(double Value, int? Decimals) : SlotValue;

/// <summary>A name or short code display from data or knowledge.</summary>
public sealed record TextValue(string Value, bool Escape) : SlotValue;

/// <summary>An instant.</summary>
public sealed record TimeValue(DateTimeOffset Value, TimeStyle Style) : SlotValue;

/// <summary>A duration in hours.</summary>
public sealed record DurationValue(double Hours) : SlotValue;

/// <summary>A laboratory result.</summary>
public sealed record ResultValue(LabResult Result) : SlotValue;

/// <summary>A nested finding.</summary>
public sealed record PhraseValue(Finding Finding) : SlotValue;

/// <summary>Several values.</summary>
public sealed record ListValue(IReadOnlyList<SlotValue> Values, string Separator) : SlotValue;
