using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Rendering;
using CdsNatremia.Core.Tests.Support;
using CdsNatremia.Core.Text;

namespace CdsNatremia.Core.Tests.Rendering;

/// <summary>The short card: at most three reasons by weight, the budget kept, cautions and the standing line never dropped.</summary>
public class CardRendererTests
{
    private static readonly RenderContext Context = new(Some.Facts(Some.Sodium(124)), TimeDisplay.Utc(Some.Now));

    private static CardContent Content(IReadOnlyList<Finding> reasons, IReadOnlyList<Finding>? cautions = null) => new()
    {
        Summary = Finding.Of(FindingKind.ActionReview),
        Headline = Finding.Of(FindingKind.ActionReview),
        Reasons = reasons,
        NextSteps = [Finding.Of(FindingKind.SeverityMildAction)],
        Cautions = cautions ?? [],
    };

    [Fact]
    public void Detail_FiveReasons_ShowsTheThreeWeightiestInTheirOrder()
    {
        var reasons = new[]
        {
            Finding.Of(FindingKind.MissingFinding, Slot.Names("tests", ["A-test"])).Weighted(1),
            Finding.Of(FindingKind.MissingFinding, Slot.Names("tests", ["B-test"])).Weighted(90),
            Finding.Of(FindingKind.MissingFinding, Slot.Names("tests", ["C-test"])).Weighted(5),
            Finding.Of(FindingKind.MissingFinding, Slot.Names("tests", ["D-test"])).Weighted(80),
            Finding.Of(FindingKind.MissingFinding, Slot.Names("tests", ["E-test"])).Weighted(70),
        };
        var detail = CardRenderer.Detail(Content(reasons), Context);
        Assert.DoesNotContain("A-test", detail, StringComparison.Ordinal);
        Assert.DoesNotContain("C-test", detail, StringComparison.Ordinal);
        Assert.True(detail.IndexOf("B-test", StringComparison.Ordinal) < detail.IndexOf("D-test", StringComparison.Ordinal));
        Assert.True(detail.IndexOf("D-test", StringComparison.Ordinal) < detail.IndexOf("E-test", StringComparison.Ordinal));
        Assert.Contains("**Next:**", detail, StringComparison.Ordinal);
    }

    [Fact]
    public void Detail_ReasonsTooLong_DropsLeastWeightyKeepsCautionsAndStandingLine()
    {
        var longName = new string('x', 120);
        var reasons = Enumerable.Range(0, 3).Select(i => Finding.Of(FindingKind.MissingFinding, Slot.Names("tests", [longName + i])).Weighted(i)).ToList();
        var caution = Finding.Of(FindingKind.OnsetAcuteCaution, Slot.Hours("hours", 20));
        var detail = CardRenderer.Detail(Content(reasons, [caution]), Context);
        Assert.True(detail.Length <= CardRenderer.DetailBudget, $"{detail.Length} characters");
        Assert.Contains(longName + "2", detail, StringComparison.Ordinal); // the weightiest stays
        Assert.DoesNotContain(longName + "0", detail, StringComparison.Ordinal);
        Assert.Contains("Acute fall (normal sodium 20 h earlier)", detail, StringComparison.Ordinal);
        Assert.Contains("Advisory only", detail, StringComparison.Ordinal);
    }

    [Fact]
    public void Detail_DataSetAsideAndAnotherPatient_OwnNamedOthersOnlyCounted()
    {
        var facts = Some.Facts(Some.Sodium(124)) with
        {
            SetAside =
            [
                new SetAsideItem("Observation/na-9", "Sodium 131 mg/dL", "unit not recognised", Analyte.Sodium),
                SetAsideItem.AboutAnotherPatient("Observation", Analyte.Sodium),
            ],
        };
        var detail = CardRenderer.Detail(Content([]), new RenderContext(facts, TimeDisplay.Utc(Some.Now)));
        // What the service could not use is said on the card (briefly; the reason in full is in the report); another
        // patient's data is counted only, never described.
        Assert.Contains("Not used: Sodium 131 mg/dL: could not be read; 1 resource(s) about another patient, ignored. Reasons in the full report.", detail, StringComparison.Ordinal);
        Assert.DoesNotContain("unit not recognised", detail, StringComparison.Ordinal);
    }
}
