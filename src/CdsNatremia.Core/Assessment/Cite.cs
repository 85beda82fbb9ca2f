using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Text;

namespace CdsNatremia.Core.Assessment;

/// <summary>How a card names the data a step used: value, unit, time, resource, and labels.</summary>
public static class Cite
{
    /// <summary>"Sodium 124 mmol/L at 2026-03-10 06:30 UTC (Observation/na-3; preliminary)", the time in the display zone.</summary>
    public static string Result(LabResult result, TimeDisplay display)
    {
        Guard.NotNull(result, nameof(result));
        Guard.NotNull(display, nameof(display));
        var phrases = Rendering.PhraseCatalogue.Default;
        var labels = new List<string> { Markdown.Escape(result.Reference) };
        if (result.IsPreliminary)
        {
            labels.Add(phrases.Text("cite.preliminary"));
        }

        if (result.IsWholeBlood)
        {
            labels.Add(phrases.Text("cite.whole-blood"));
        }

        if (result.Origin == DataOrigin.FhirServer)
        {
            labels.Add(phrases.Text("cite.fetched"));
        }

        if (result.OriginalUnit is { } unit && !string.Equals(unit, result.Unit, StringComparison.OrdinalIgnoreCase)
            && result.OriginalValue is { } original)
        {
            labels.Add(phrases.Render(Findings.Finding.Of("cite.reported-as", Findings.Slot.Number("value", original), Findings.Slot.Text("unit", unit)), display));
        }

        return phrases.Render(
            Findings.Finding.Of(
                "cite.result",
                Findings.Slot.Verbatim("analyte", AnalyteUnits.DisplayName(result.Analyte)),
                Findings.Slot.Number("value", result.Value),
                Findings.Slot.Verbatim("unit", result.Unit),
                Findings.Slot.Time("time", result.EffectiveAt),
                Findings.Slot.Verbatim("labels", string.Join("; ", labels))),
            display);
    }

    /// <summary>"Observation/na-9 (Sodium 131 mg/dL, 2026-03-09 08:00 UTC): reason".</summary>
    public static string SetAside(SetAsideItem item, TimeDisplay display)
    {
        Guard.NotNull(item, nameof(item));
        Guard.NotNull(display, nameof(display));
        if (item.State == FactState.NotThisPatient)
        {
            // Privacy: another patient's data is never shown, not even its id or time.
            return Rendering.PhraseCatalogue.Default.Text("cite.another-patient");
        }

        var when = item.At is { } at ? ", " + display.Time(at) : string.Empty;
        return $"{Markdown.Escape(item.Reference)} ({Markdown.Escape(item.What)}{when}): {Markdown.Escape(item.Reason)}";
    }
}
