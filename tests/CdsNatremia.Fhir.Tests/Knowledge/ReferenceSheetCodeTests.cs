using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Knowledge;
using CdsNatremia.Fhir.Knowledge;
using CdsNatremia.Fhir.Tests.Support;
using Hl7.Fhir.Serialization;

namespace CdsNatremia.Fhir.Tests.Knowledge;

/// <summary>
/// Every code of the primary-tier drug groups checked against the project reference sheet
/// (/work/shared/guides/clinical-reference.md, section "Medication codes for the drug-cause checks"), whose table is
/// encoded below with the sheet's status words. A code that is not on the sheet must say in its file's description
/// that it is from memory or secondary.
/// </summary>
public class ReferenceSheetCodeTests
{
    private const string Verified = "verified";
    private const string FromMemory = "from memory";

    /// <summary>The reference sheet's medication codes: system, code, name, status, the group it belongs to.</summary>
    private static readonly (string System, string Code, string Name, string Status, string Group)[] Sheet =
    [
        // RxNorm ingredient RxCUIs (reference sheet: "verified, public concept set"; chlorothiazide and oxcarbazepine from memory).
        (CodeSystems.RxNorm, "5487", "hydrochlorothiazide", Verified, "drug-thiazide"),
        (CodeSystems.RxNorm, "2409", "chlorthalidone", Verified, "drug-thiazide"),
        (CodeSystems.RxNorm, "5764", "indapamide", Verified, "drug-thiazide"),
        (CodeSystems.RxNorm, "6916", "metolazone", Verified, "drug-thiazide"),
        (CodeSystems.RxNorm, "1369", "bendroflumethiazide", Verified, "drug-thiazide"),
        (CodeSystems.RxNorm, "2396", "chlorothiazide", FromMemory, "drug-thiazide"),
        (CodeSystems.RxNorm, "36437", "sertraline", Verified, "drug-ssri"),
        (CodeSystems.RxNorm, "4493", "fluoxetine", Verified, "drug-ssri"),
        (CodeSystems.RxNorm, "321988", "escitalopram", Verified, "drug-ssri"),
        (CodeSystems.RxNorm, "2556", "citalopram", Verified, "drug-ssri"),
        (CodeSystems.RxNorm, "32937", "paroxetine", Verified, "drug-ssri"),
        (CodeSystems.RxNorm, "42355", "fluvoxamine", Verified, "drug-ssri"),
        (CodeSystems.RxNorm, "2002", "carbamazepine", Verified, "drug-carbamazepine-family"),
        (CodeSystems.RxNorm, "32624", "oxcarbazepine", FromMemory, "drug-carbamazepine-family"),

        // WHO ATC substances (reference sheet: verified; C03AA04 chlorothiazide from memory).
        (CodeSystems.Atc, "C03AA01", "bendroflumethiazide", Verified, "drug-thiazide"),
        (CodeSystems.Atc, "C03AA03", "hydrochlorothiazide", Verified, "drug-thiazide"),
        (CodeSystems.Atc, "C03AA04", "chlorothiazide", FromMemory, "drug-thiazide"),
        (CodeSystems.Atc, "C03BA04", "chlortalidone", Verified, "drug-thiazide"),
        (CodeSystems.Atc, "C03BA08", "metolazone", Verified, "drug-thiazide"),
        (CodeSystems.Atc, "C03BA10", "xipamide", Verified, "drug-thiazide"),
        (CodeSystems.Atc, "C03BA11", "indapamide", Verified, "drug-thiazide"),
        (CodeSystems.Atc, "N06AB03", "fluoxetine", Verified, "drug-ssri"),
        (CodeSystems.Atc, "N06AB04", "citalopram", Verified, "drug-ssri"),
        (CodeSystems.Atc, "N06AB05", "paroxetine", Verified, "drug-ssri"),
        (CodeSystems.Atc, "N06AB06", "sertraline", Verified, "drug-ssri"),
        (CodeSystems.Atc, "N06AB08", "fluvoxamine", Verified, "drug-ssri"),
        (CodeSystems.Atc, "N06AB10", "escitalopram", Verified, "drug-ssri"),
        (CodeSystems.Atc, "N03AF01", "carbamazepine", Verified, "drug-carbamazepine-family"),
        (CodeSystems.Atc, "N03AF02", "oxcarbazepine", Verified, "drug-carbamazepine-family"),
        (CodeSystems.Atc, "N03AF04", "eslicarbazepine", Verified, "drug-carbamazepine-family"),

        // WHO ATC classes (reference sheet: verified).
        (CodeSystems.Atc, "C03AA", "thiazides, plain", Verified, "drug-thiazide"),
        (CodeSystems.Atc, "C03BA", "sulfonamides, plain", Verified, "drug-thiazide"),
        (CodeSystems.Atc, "C03EA", "low-ceiling diuretics and potassium-sparing agents", Verified, "drug-thiazide"),
        (CodeSystems.Atc, "C09BA", "ACE inhibitors and diuretics", Verified, "drug-thiazide"),
        (CodeSystems.Atc, "C09DA", "angiotensin II receptor blockers and diuretics", Verified, "drug-thiazide"),
        (CodeSystems.Atc, "N06AB", "SSRIs", Verified, "drug-ssri"),

        // SNOMED CT substances (reference sheet: verified in public concept maps).
        (CodeSystems.SnomedCt, "387525002", "hydrochlorothiazide", Verified, "drug-thiazide"),
        (CodeSystems.SnomedCt, "387324004", "chlortalidone", Verified, "drug-thiazide"),
        (CodeSystems.SnomedCt, "372596005", "citalopram", Verified, "drug-ssri"),
        (CodeSystems.SnomedCt, "400447003", "escitalopram", Verified, "drug-ssri"),
        (CodeSystems.SnomedCt, "372767007", "fluoxetine", Verified, "drug-ssri"),
        (CodeSystems.SnomedCt, "372905008", "fluvoxamine", Verified, "drug-ssri"),
        (CodeSystems.SnomedCt, "372594008", "sertraline", Verified, "drug-ssri"),
        (CodeSystems.SnomedCt, "387222003", "carbamazepine", Verified, "drug-carbamazepine-family"),
    ];

    private static readonly KnowledgeBase Knowledge = KnowledgeLoader.Load(Profiles.Directory()).Base;

    private static IEnumerable<CodeSet> PrimarySets()
        => Knowledge.WithIdPrefix("drug-").Where(s => s.Tier == EvidenceTier.Primary);

    private static IReadOnlyDictionary<string, string> RowsOf(CodeSet set)
    {
        var valueSet = new FhirJsonDeserializer().Deserialize<Hl7.Fhir.Model.ValueSet>(
            File.ReadAllText(Path.Combine(Profiles.Directory(), "valuesets", set.Id + ".json")));
        return DescriptionTable.Rows(valueSet.Description);
    }

    [Fact]
    public void PrimaryTier_IsTheThreeGroupsOfTheSheet()
        => Assert.Equal(["drug-carbamazepine-family", "drug-ssri", "drug-thiazide"], PrimarySets().Select(s => s.Id));

    [Fact]
    public void PrimaryTierCodes_OnTheSheet_HaveTheSheetsGroupAndStatus_OthersAreMarkedFromMemoryOrSecondary()
    {
        var checkedCount = 0;
        foreach (var set in PrimarySets())
        {
            var rows = RowsOf(set);
            foreach (var code in set.Codes.Concat(set.Prefixes))
            {
                var status = rows[code.Code];
                var onSheet = Sheet.Where(s => s.System == code.System && s.Code == code.Code).ToList();
                if (onSheet.Count == 0)
                {
                    Assert.True(status.StartsWith(FromMemory, StringComparison.Ordinal) || status.StartsWith("secondary", StringComparison.Ordinal),
                        $"{set.Id}: {code.System} {code.Code} is not on the reference sheet but is marked '{status}'");
                }
                else
                {
                    var row = onSheet.Single();
                    Assert.Equal(row.Group, set.Id);
                    Assert.True(
                        row.Status == Verified ? status.StartsWith(Verified, StringComparison.Ordinal) : !status.StartsWith(Verified, StringComparison.Ordinal),
                        $"{set.Id}: {code.Code} is '{row.Status}' on the sheet but '{status}' in the file");
                }

                checkedCount++;
            }
        }

        Assert.True(checkedCount >= Sheet.Length, $"only {checkedCount} codes checked");
    }

    [Fact]
    public void PrimaryTierCodes_OnTheSheet_CarryTheSheetsIngredientName()
    {
        foreach (var row in Sheet.Where(r => r.Code.Length > 5 || r.System != CodeSystems.Atc))
        {
            var set = Knowledge.Find(row.Group)!;
            var code = set.Codes.SingleOrDefault(c => c.System == row.System && c.Code == row.Code);
            Assert.True(code.Code is not null, $"{row.Group} lacks {row.System} {row.Code} ({row.Name}) from the reference sheet");
            // The name must be one of the set's names for text matching (display or designation).
            Assert.Contains(row.Name, set.Names);
        }
    }

    [Fact]
    public void EverySheetCode_IsInItsGroup()
    {
        foreach (var row in Sheet)
        {
            var set = Knowledge.Find(row.Group)!;
            var present = set.Codes.Any(c => c.System == row.System && c.Code == row.Code)
                || set.Prefixes.Any(c => c.System == row.System && c.Code == row.Code);
            Assert.True(present, $"{row.Group} lacks {row.System} {row.Code} ({row.Name})");
        }
    }

    [Fact]
    public void Ssri_NeverCarriesRxNorm35636()
        // Reference sheet: public files have given citalopram RxCUI 35636, which is risperidone.
        => Assert.False(Knowledge.Find("drug-ssri")!.Matches(new CodeRef(CodeSystems.RxNorm, "35636")));
}
