using System.Reflection;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Rendering;
using CdsNatremia.Core.Tests.Support;
using CdsNatremia.Core.Text;

namespace CdsNatremia.Core.Tests.Rendering;

/// <summary>The one phrase catalogue: complete both ways, and worded as the renderers promise.</summary>
public class PhraseCatalogueTests
{
    /// <summary>Frame phrases (headings and standing lines) read by key, not by a finding kind.</summary>
    private static readonly string[] FramePrefixes = ["card.", "report.", "caution.", "cite."];

    private static IReadOnlyList<string> Kinds() => typeof(FindingKind)
        .GetFields(BindingFlags.Public | BindingFlags.Static)
        .Where(f => f.IsLiteral && f.FieldType == typeof(string))
        .Select(f => (string)f.GetRawConstantValue()!)
        .ToList();

    [Fact]
    public void EveryFindingKind_HasAPhrase()
    {
        var missing = Kinds().Where(k => !PhraseCatalogue.Default.Contains(k)).ToList();
        Assert.True(missing.Count == 0, "kinds without wording: " + string.Join(", ", missing));
    }

    [Fact]
    public void EveryPhrase_BelongsToAKindOrTheFrame()
    {
        var kinds = Kinds().ToHashSet(StringComparer.Ordinal);
        var orphans = PhraseCatalogue.Default.Keys
            .Where(k => !kinds.Contains(k) && !FramePrefixes.Any(p => k.StartsWith(p, StringComparison.Ordinal)))
            .Order(StringComparer.Ordinal)
            .ToList();
        Assert.True(orphans.Count == 0, "phrases no finding kind names: " + string.Join(", ", orphans));
    }

    [Fact]
    public void Render_SlotsOfEveryType_WordedAsUsed()
    {
        // Numbers print as used (ClinicalNumber: "a number shown is the number used"), computed results rounded
        // explicitly, names escaped for Markdown, times in the display zone.
        var display = TimeDisplay.Utc(Some.Now);
        var finding = Finding.Of(
            FindingKind.OnsetAcuteFinding,
            Slot.Number("normal", 138),
            Slot.Hours("hours", 30));
        Assert.Equal("**Acute** onset: normal sodium 138 mmol/L 30 h earlier.", PhraseCatalogue.Default.Render(finding, display));

        var result = Some.Sodium(124, hoursAgo: 3, id: "na-3");
        var step = Finding.Of(
            FindingKind.SeverityStep,
            Slot.Result("result", result),
            Slot.Text("band", "profound"),
            Slot.Text("range", "below 125 mmol/L"),
            Slot.Verbatim("source", "2014 European guideline"));
        Assert.Equal(
            "**Severity**: Sodium 124 mmol/L at 2026-03-10 09:00 UTC (Observation/na-3) is in the profound band (below 125 mmol/L; 2014 European guideline).",
            PhraseCatalogue.Default.Render(step, display));
    }

    [Fact]
    public void Render_SlotTheFindingLacks_Throws()
    {
        var finding = Finding.Of(FindingKind.OnsetAcuteFinding, Slot.Number("normal", 138));
        var error = Assert.Throws<InvalidOperationException>(() => PhraseCatalogue.Default.Render(finding, TimeDisplay.Utc(Some.Now)));
        Assert.Contains("'hours'", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Render_UnknownKind_Throws()
        => Assert.Throws<KeyNotFoundException>(() => PhraseCatalogue.Default.Render(Finding.Of("no.such.kind"), TimeDisplay.Utc(Some.Now)));

    [Fact]
    public void Render_TimeSlot_FollowsTheDisplayZone()
    {
        var finding = Finding.Of(FindingKind.DiureticSince, Slot.Time("time", new DateTimeOffset(2026, 3, 10, 6, 30, 0, TimeSpan.Zero)));
        Assert.Equal("since 2026-03-10 06:30 UTC", PhraseCatalogue.Default.Render(finding, TimeDisplay.Utc(Some.Now)));
        var berlin = new TimeDisplay(TimeZoneInfo.FindSystemTimeZoneById("Europe/Berlin"), Some.Now);
        Assert.Equal("since 2026-03-10 07:30 (UTC+01:00)", PhraseCatalogue.Default.Render(finding, berlin));
    }
}
