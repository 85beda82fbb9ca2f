using CdsNatremia.Core.Course;
using CdsNatremia.Core.Drugs;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Knowledge;
using CdsNatremia.Core.Sodium;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.Course;

public class CourseModelBuilderTests
{
    private static CourseModel Build(PatientFacts facts, RuleOptions? options = null, KnowledgeBase? knowledge = null)
        => CourseModelBuilder.Build(new DecisionContext(Some.Request(facts), options ?? new RuleOptions(), knowledge ?? SomeDrugs.Knowledge));

    [Fact]
    public void Build_Nadir118_LimitLinesAtNadirPlusTenAndEighteen()
    {
        // 2014 European guideline (Spasovski et al. 2014; reference sheet, secondary): ≤ 10 mmol/L in the first 24 h and
        // ≤ 8 in each 24 h after, so 118 + 10 = 128 for the first day and 118 + 18 = 136 by 48 h.
        var nadir = Some.Sodium(118, hoursAgo: 10, id: "na-nadir");
        var model = Build(Some.Facts(Some.Sodium(131, hoursAgo: 60), nadir, Some.Sodium(122, hoursAgo: 2)));
        var envelope = Assert.IsType<CorrectionEnvelope>(model.Envelope);
        Assert.Equal(118, envelope.Nadir.Value);
        Assert.Equal("Observation/na-nadir", envelope.Nadir.Reference);
        Assert.False(envelope.HighRisk);
        var day = envelope.Line(EnvelopeLineKind.FirstDayLimit)!;
        Assert.Equal(128, day.Value);
        Assert.Equal(nadir.EffectiveAt, day.From);
        Assert.Equal(nadir.EffectiveAt.AddHours(24), day.To);
        Assert.True(day.Governs);
        var twoDays = envelope.Line(EnvelopeLineKind.TwoDayLimit)!;
        Assert.Equal(136, twoDays.Value);
        Assert.Equal(nadir.EffectiveAt.AddHours(24), twoDays.From);
        Assert.Equal(nadir.EffectiveAt.AddHours(48), twoDays.To);
        Assert.Null(envelope.Line(EnvelopeLineKind.HighRiskDayLimit));
        // US expert panel (Verbalis et al. 2013; reference sheet, secondary): minimum goal 4 mmol/L per day → 122.
        Assert.Equal(122, envelope.Line(EnvelopeLineKind.MinimumGoal)!.Value);
    }

    [Fact]
    public void Build_Nadir118WithLowPotassium_HighRiskLineAtNadirPlusEightGoverns()
    {
        // US expert panel (Verbalis et al. 2013; reference sheet, secondary): low potassium puts the patient at high risk;
        // 8 mmol/L in any 24 h → 118 + 8 = 126; 48 h: 16 (8 in each 24 h, derived) → 134.
        var facts = Some.Facts(Some.Sodium(118, hoursAgo: 10), Some.Lab(Analyte.Potassium, 2.8, hoursAgo: 10), Some.Sodium(121, hoursAgo: 2));
        var envelope = Build(facts).Envelope!;
        Assert.True(envelope.HighRisk);
        Assert.Contains("low potassium", envelope.HighRiskFactors);
        var highRisk = envelope.Line(EnvelopeLineKind.HighRiskDayLimit)!;
        Assert.Equal(126, highRisk.Value);
        Assert.True(highRisk.Governs);
        Assert.Equal(134, envelope.Line(EnvelopeLineKind.HighRiskTwoDayLimit)!.Value);
        Assert.False(envelope.Line(EnvelopeLineKind.FirstDayLimit)!.Governs);
        Assert.Equal(128, envelope.Line(EnvelopeLineKind.FirstDayLimit)!.Value);
    }

    [Fact]
    public void Build_UsPanelPreset_FortyEightHourLineAtNadirPlusEighteen()
    {
        // US expert panel (Verbalis et al. 2013; reference sheet, secondary): 10 in 24 h (lower end of 10–12), 18 in 48 h.
        var options = new RuleOptions { CorrectionRate = new() { Preset = CdsNatremia.Core.CorrectionRate.CorrectionRatePreset.UsExpertPanel2013 } };
        var envelope = Build(Some.Facts(Some.Sodium(120, hoursAgo: 5)), options).Envelope!;
        Assert.Equal(130, envelope.Line(EnvelopeLineKind.FirstDayLimit)!.Value);
        Assert.Equal(138, envelope.Line(EnvelopeLineKind.TwoDayLimit)!.Value);
    }

    [Fact]
    public void Build_NormalSodiumOnly_NoEnvelopeAndSaysWhy()
    {
        // 135 mmol/L is the lower limit of normal (2014 European guideline; reference sheet, verified): no correction to watch.
        var model = Build(Some.Facts(Some.Sodium(140, hoursAgo: 5)));
        Assert.Null(model.Envelope);
        Assert.Contains("not low", model.EnvelopeNote, StringComparison.Ordinal);
    }

    [Fact]
    public void Build_Bands_EdgesFromTheEuropeanGuideline()
    {
        // 2014 European guideline (reference sheet, verified): mild 130–135, moderate 125–129, profound < 125 mmol/L.
        var bands = Build(Some.Facts(Some.Sodium(128))).Bands;
        Assert.Equal([SeverityBand.Profound, SeverityBand.Moderate, SeverityBand.Mild, SeverityBand.Normal], bands.Select(b => b.Band));
        Assert.Equal((125d, 130d), (bands[1].From, bands[1].To));
        Assert.Equal((130d, 135d), (bands[2].From, bands[2].To));
        Assert.Equal((135d, 145d), (bands[3].From, bands[3].To));
        Assert.Equal(125, bands[0].To);
    }

    [Fact]
    public void Build_PointsBoundsAndSetAside_KeptApartWithReasons()
    {
        var usable = Some.Sodium(126, hoursAgo: 20, id: "na-1");
        var bound = Some.Sodium(100, hoursAgo: 10, id: "na-bound") with { Comparator = ValueComparator.LessThan };
        var facts = Some.Facts(usable) with
        {
            BoundedLabs = [bound],
            SetAside =
            [
                new SetAsideItem("Observation/na-x", "Sodium 131 mg/dL", "the unit mg/dL is not a sodium unit", Analyte.Sodium, Some.Now.AddHours(-4)),
                SetAsideItem.AboutAnotherPatient("Observation", Analyte.Sodium),
            ],
        };
        var model = Build(facts);
        var point = Assert.Single(model.Points);
        Assert.Equal(126, point.Value);
        Assert.Equal(SeverityBand.Moderate, point.Band);
        var b = Assert.Single(model.Bounds);
        Assert.Equal(100, b.Value);
        Assert.True(b.PointsDown);
        Assert.Equal("below 100", b.Description);
        var aside = Assert.Single(model.SetAside);
        Assert.Equal("the unit mg/dL is not a sodium unit", aside.Reason);
        Assert.Equal(1, model.AboutAnotherPatientCount);
        Assert.DoesNotContain(model.Points, p => p.Value == 100);
    }

    [Fact]
    public void Build_ThiazideStartedBeforeTheFall_BarFromItsStartAndLikely()
    {
        // Timing rule of this service (docs/knowledge.md): a drug started before the fall is a likely contributor.
        var started = Some.Now.AddDays(-21);
        var facts = Some.Facts(Some.Sodium(138, hoursAgo: 24 * 28), Some.Sodium(124, hoursAgo: 3)) with
        {
            Medications = [SomeDrugs.Statement("ms-1", "hydrochlorothiazide 25 mg", started, SomeDrugs.RxNorm("5487"))],
        };
        var model = Build(facts);
        var drug = Assert.Single(model.Drugs);
        Assert.Equal(started, drug.Start);
        Assert.Null(drug.End);
        Assert.True(drug.Ongoing);
        Assert.Equal(TimingVerdict.Likely, drug.Verdict);
        Assert.True(model.From <= started);
    }

    [Fact]
    public void Build_SalineOrderWithWeight_PredictionByAdrogueMadias()
    {
        // Adrogué–Madias (N Engl J Med 2000; reference sheet, secondary): (513 − 120) / (70 × 0.5 + 1) = 393 / 36 = 10.9 mmol/L
        // per litre of 3% saline (513 mmol/L, reference sheet) for a woman under 70 weighing 70 kg (fraction 0.5, reference sheet);
        // 500 mL → 5.5 (10.9 × 0.5 = 5.45, rounded away from zero).
        var facts = SomeClinical.Woman(50, Some.Sodium(120, hoursAgo: 2), Some.Lab(Analyte.BodyWeight, 70, hoursAgo: 5));
        var order = SomeClinical.Draft("mr-3", "sodium chloride 3% infusion", 500, "intravenous");
        var model = CourseModelBuilder.Build(new DecisionContext(Some.Request(facts) with { DraftOrders = [order] }, new RuleOptions(), SomeClinical.Knowledge));
        var fluid = Assert.Single(model.Orders);
        Assert.Equal(CourseOrderKind.Fluid, fluid.Kind);
        Assert.Equal(10.9, fluid.ChangePerLitre);
        Assert.Equal(5.5, fluid.ChangeForVolume);
    }

    [Fact]
    public void Build_VaptanOrder_ShownWithoutAFormulaPrediction()
    {
        var facts = Some.Facts(Some.Sodium(127, hoursAgo: 2));
        var order = SomeDrugs.Draft("mr-v", "tolvaptan 15 mg", SomeDrugs.Atc("C03XA01"));
        var model = CourseModelBuilder.Build(new DecisionContext(Some.Request(facts) with { DraftOrders = [order] }, new RuleOptions(), SomeDrugs.Knowledge));
        var vaptan = Assert.Single(model.Orders);
        Assert.Equal(CourseOrderKind.Vaptan, vaptan.Kind);
        Assert.Null(vaptan.ChangePerLitre);
    }
}
