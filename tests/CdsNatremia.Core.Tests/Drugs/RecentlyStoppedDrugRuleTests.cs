using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Drugs;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Rendering;
using CdsNatremia.Core.Text;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.Drugs;

/// <summary>
/// A medicine that can lower sodium and stopped within the look-back (DrugCauseOptions.RecentlyStoppedWithinDays, default
/// 14 days, from memory: a drug's effect on sodium can outlast the last dose) is a possible contributor, never a likely one.
/// </summary>
public class RecentlyStoppedDrugRuleTests
{
    private static MedicationFact Thiazide(DateTimeOffset? ended, DateTimeOffset? lastRecorded = null)
        => SomeDrugs.Statement("hctz-old", "hydrochlorothiazide 25 mg", Some.Now.AddDays(-60), SomeDrugs.RxNorm("5487")) with
        {
            Use = MedicationUse.Stopped,
            EndedAt = ended,
            LastRecordedAt = lastRecorded,
        };

    private static Card Assessment(params MedicationFact[] stopped)
        => Some.Engine(knowledge: SomeDrugs.Knowledge)
            .Decide(Some.Request(Some.Facts(Some.Sodium(138, hoursAgo: 24 * 28), Some.Sodium(126)) with { StoppedMedications = stopped }))
            .Single(c => c.Topic == "sodium-assessment");

    [Fact]
    public void Apply_ThiazideStoppedFourDaysAgo_PossibleContributorNeverLikely()
    {
        var card = Assessment(Thiazide(Some.Now.AddDays(-4)));
        var content = card.Content!;
        var step = Assert.Single(content.Steps, f => f.Kind == FindingKind.DrugStoppedStep);
        Assert.Equal(Certainty.Possible, step.Certainty);
        Assert.Equal(new NumberValue(14, null), step["days"]); // the default look-back, as used
        Assert.Single(content.Causes, f => f.Kind == FindingKind.DrugStoppedCause && f.Certainty == Certainty.Possible);
        Assert.DoesNotContain(content.Reasons, f => f.Kind is FindingKind.DrugLikely or FindingKind.DrugLikelyHeartFailure);
        Assert.DoesNotContain("likely cause", card.Summary, StringComparison.Ordinal);
        Assert.Contains("drug.recently-stopped", card.RuleIds);
        Assert.Contains(
            "**Recently stopped medicine**: hydrochlorothiazide (thiazide or thiazide-like diuretic), stopped 2026-03-06 12:00 UTC (MedicationStatement/hctz-old), within the 14-day look-back",
            card.Report,
            StringComparison.Ordinal);
    }

    [Fact]
    public void Apply_StoppedBeyondTheLookBack_NotListed()
    {
        // 15 days ago: outside the 14-day default look-back.
        var card = Assessment(Thiazide(Some.Now.AddDays(-15)));
        Assert.DoesNotContain("drug.recently-stopped", card.RuleIds);
        Assert.DoesNotContain(card.Content!.Steps, f => f.Kind == FindingKind.DrugStoppedStep);
    }

    [Fact]
    public void Stopped_ThreeWaysOfKnowingWhen_OneKindEach()
    {
        var display = TimeDisplay.Utc(Some.Now);
        var ended = RecentlyStopped.Stopped(Thiazide(Some.Now.AddDays(-4)));
        var recorded = RecentlyStopped.Stopped(Thiazide(null, Some.Now.AddDays(-2)));
        var undated = RecentlyStopped.Stopped(Thiazide(null));
        Assert.Equal(FindingKind.DrugStoppedEnded, ended.Kind);
        Assert.Equal("stopped on or before 2026-03-08 12:00 UTC (MedicationStatement/hctz-old)", PhraseCatalogue.Default.Render(recorded, display));
        // No date at all: "recent" is assumed, never known (the cautious reading); the finding says unknown.
        Assert.Equal(FindingKind.DrugStoppedUndated, undated.Kind);
        Assert.Equal(Certainty.Unknown, undated.Certainty);
        Assert.Equal("stop date not recorded (MedicationStatement/hctz-old)", PhraseCatalogue.Default.Render(undated, display));
    }
}
