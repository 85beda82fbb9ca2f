using System.Text.RegularExpressions;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.Properties;

/// <summary>
/// Property over generated charts: corrupting any one input (set aside as unreadable, arriving as another patient's,
/// or a medicine whose product could not be read) never makes the answer <b>more reassuring</b> than the same chart
/// with that input absent. Unknown is never normal (patient-safety rule of the project; common practice).
/// <para>
/// Reassurance order, most reassuring first, compared in this order: no card at all; a lower top indicator (info
/// before warning before critical); fewer cards; more reassuring claims in the text (a criterion "met", "consistent
/// with SIADH", a rate "within the limit", "none found in the record", "the usual limits apply").
/// </para>
/// The generator is seeded and deterministic: a failure names its seed, input and corruption, and replays the same.
/// </summary>
public partial class CorruptedInputPropertyTests
{
    private const int Charts = 100;

    /// <summary>Reassurance as a tuple compared left to right; larger is more reassuring.</summary>
    private readonly record struct Reassurance(int Silent, int NegativeTopIndicator, int NegativeCardCount, int ReassuringClaims) : IComparable<Reassurance>
    {
        public int CompareTo(Reassurance other)
        {
            var c = Silent.CompareTo(other.Silent);
            c = c != 0 ? c : NegativeTopIndicator.CompareTo(other.NegativeTopIndicator);
            c = c != 0 ? c : NegativeCardCount.CompareTo(other.NegativeCardCount);
            return c != 0 ? c : ReassuringClaims.CompareTo(other.ReassuringClaims);
        }

        public static Reassurance Of(IReadOnlyList<Card> cards) => new(
            cards.Count == 0 ? 1 : 0,
            cards.Count == 0 ? 0 : -(int)cards.Max(c => c.Indicator),
            -cards.Count,
            cards.Sum(c => ReassuringClaim().Count(c.Report)));
    }

    [GeneratedRegex(@": \*\*met\*\*|consistent with SIADH|within the limit|none found in the record|the usual limits apply")]
    private static partial Regex ReassuringClaim();

    private enum Corruption
    {
        Unreadable,
        AnotherPatients,
    }

    [Fact]
    public void Decide_AnyOneInputCorrupted_NeverMoreReassuringThanThatInputAbsent()
    {
        var engine = Some.Engine(knowledge: SomeDrugs.Knowledge);
        var checkedPairs = 0;
        var lessReassuring = 0;
        for (var seed = 1; seed <= Charts; seed++)
        {
            var chart = Generate(new Random(seed), seed);
            for (var i = 0; i < chart.Labs.Count; i++)
            {
                var input = chart.Labs[i];
                var absent = chart with { Labs = [.. chart.Labs.Where((_, j) => j != i)] };
                var baseline = Reassurance.Of(engine.Decide(Some.Request(absent)));
                foreach (var corruption in Enum.GetValues<Corruption>())
                {
                    var item = corruption == Corruption.Unreadable
                        ? new SetAsideItem(input.Reference, AnalyteUnits.DisplayName(input.Analyte) + " (unreadable)", "value could not be read", input.Analyte, input.EffectiveAt)
                        : SetAsideItem.AboutAnotherPatient("Observation", input.Analyte);
                    var corrupted = absent with { SetAside = [.. absent.SetAside, item] };
                    var result = Reassurance.Of(engine.Decide(Some.Request(corrupted)));
                    Assert.True(result.CompareTo(baseline) <= 0, $"seed {seed}, {input.Reference} ({input.Analyte} {input.Value}) {corruption}: {result} is more reassuring than absent {baseline}");
                    checkedPairs++;
                    lessReassuring += result.CompareTo(baseline) < 0 ? 1 : 0;
                }
            }

            for (var i = 0; i < chart.Medications.Count; i++)
            {
                var input = chart.Medications[i];
                var absent = chart with { Medications = [.. chart.Medications.Where((_, j) => j != i)] };
                var unreadable = input with { ProductCodes = [], Text = "tablet (pharmacy record)", ProductUnreadable = "its Medication resource was not in the data received" };
                var corrupted = absent with { Medications = [.. absent.Medications, unreadable] };
                var baseline = Reassurance.Of(engine.Decide(Some.Request(absent)));
                var result = Reassurance.Of(engine.Decide(Some.Request(corrupted)));
                Assert.True(result.CompareTo(baseline) <= 0, $"seed {seed}, {input.Reference} unreadable product: {result} is more reassuring than absent {baseline}");
                checkedPairs++;
                lessReassuring += result.CompareTo(baseline) < 0 ? 1 : 0;
            }
        }

        Assert.True(checkedPairs > Charts * 4, $"only {checkedPairs} pairs checked");

        // Not vacuous: an unreadable input must often make the answer strictly less reassuring (an unreadable newest sodium
        // is no longer silence; a diuretic criterion becomes "could not be read" instead of "met").
        Assert.True(lessReassuring > Charts / 10, $"only {lessReassuring} of {checkedPairs} corruptions made the answer less reassuring");
    }

    [Fact]
    public void Reassurance_Order_SilenceThenIndicatorThenCountThenClaims()
    {
        Card Make(CardIndicator indicator, string detail = "") => new() { Summary = "s", Indicator = indicator, Report = detail, Topic = "t", RuleIds = [] };
        var silent = Reassurance.Of([]);
        var info = Reassurance.Of([Make(CardIndicator.Info)]);
        var infoWithClaim = Reassurance.Of([Make(CardIndicator.Info, "(1) No recent diuretic use: **met**: none.")]);
        var warning = Reassurance.Of([Make(CardIndicator.Warning, "x: **met**, y: **met**")]);
        var twoInfo = Reassurance.Of([Make(CardIndicator.Info), Make(CardIndicator.Info)]);
        Assert.True(silent.CompareTo(infoWithClaim) > 0);
        Assert.True(infoWithClaim.CompareTo(info) > 0);
        Assert.True(info.CompareTo(twoInfo) > 0);
        Assert.True(twoInfo.CompareTo(warning) > 0);
    }

    [Fact]
    public void Generate_SameSeed_SameChart()
    {
        var a = Generate(new Random(7), 7);
        var b = Generate(new Random(7), 7);
        Assert.Equal(a.Labs, b.Labs);
        Assert.Equal(a.Medications.Select(m => m.Reference), b.Medications.Select(m => m.Reference));
    }

    /// <summary>An invented chart: 1–4 sodium results over the last 90 h, some work-up results near the newest, maybe medicines.</summary>
    private static PatientFacts Generate(Random random, int seed)
    {
        var labs = new List<LabResult>();
        var count = random.Next(1, 5);
        var hours = Enumerable.Range(0, count).Select(_ => Math.Round(random.NextDouble() * 90, 1)).Distinct().OrderByDescending(h => h).ToList();
        foreach (var (h, n) in hours.Select((h, n) => (h, n)))
        {
            labs.Add(Some.Sodium(random.Next(112, 143), h, id: $"g{seed}-na-{n}"));
        }

        var newest = hours.Min();
        void Maybe(Analyte analyte, double low, double high)
        {
            if (random.NextDouble() < 0.5)
            {
                labs.Add(Some.Lab(analyte, Math.Round(low + (random.NextDouble() * (high - low)), 1), newest + 0.5, id: $"g{seed}-{analyte}"));
            }
        }

        Maybe(Analyte.SerumOsmolality, 245, 300);
        Maybe(Analyte.Glucose, 4, 30);
        Maybe(Analyte.Urea, 2, 20);
        Maybe(Analyte.UrineOsmolality, 60, 700);
        Maybe(Analyte.UrineSodium, 5, 90);
        Maybe(Analyte.Thyrotropin, 0.2, 9);
        Maybe(Analyte.Cortisol, 80, 700);
        Maybe(Analyte.Potassium, 2.8, 5.2);

        var medications = new List<MedicationFact>();
        if (random.NextDouble() < 0.5)
        {
            // RxNorm 5487 hydrochlorothiazide (reference sheet, verified).
            medications.Add(SomeDrugs.Statement($"g{seed}-hctz", "hydrochlorothiazide 25 mg", Some.Now.AddDays(-random.Next(1, 60)), SomeDrugs.RxNorm("5487")));
        }

        if (random.NextDouble() < 0.3)
        {
            // RxNorm 2556 citalopram (reference sheet, verified).
            medications.Add(SomeDrugs.Statement($"g{seed}-cit", "citalopram 20 mg", Some.Now.AddDays(-random.Next(1, 60)), SomeDrugs.RxNorm("2556")));
        }

        return Some.Facts([.. labs]) with { Medications = medications };
    }
}
