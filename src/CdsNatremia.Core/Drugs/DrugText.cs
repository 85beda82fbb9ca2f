using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Knowledge;

namespace CdsNatremia.Core.Drugs;

/// <summary>
/// The shared findings of the drug cards: a drug's name, its group and tier, how it matched, and what clinicians usually
/// consider. Findings only: the wording is in the phrase catalogue (<c>Phrases/Drugs.resx</c>).
/// </summary>
public static class DrugText
{
    /// <summary>The source cited for the drug groups and their codes (bibliographic data).</summary>
    public const string KnowledgeSource = "Drug groups and codes: CdsNatremia knowledge files (profiles/valuesets; each code's source is listed in its file)";

    /// <summary>The drug's name (the matched ingredient), a name from knowledge or data: escaped when printed.</summary>
    public static Slot Name(MedicationMatch match, string slot = "drug") => Slot.Text(slot, Guard.NotNull(match, nameof(match)).Ingredient);

    /// <summary>The group's label, a name from knowledge.</summary>
    public static Slot Group(CodeSet set, string slot = "group") => Slot.Text(slot, Guard.NotNull(set, nameof(set)).Label);

    /// <summary>"thiazide or thiazide-like diuretic; primary tier: a well-established cause".</summary>
    public static Finding GroupAndTier(CodeSet set)
        => Finding.Of(Guard.NotNull(set, nameof(set)).Tier == EvidenceTier.Primary ? FindingKind.DrugGroupPrimary : FindingKind.DrugGroupSecondary, Group(set));

    /// <summary>"primary tier" or "secondary tier".</summary>
    public static Finding Tier(CodeSet set)
        => Finding.Of(Guard.NotNull(set, nameof(set)).Tier == EvidenceTier.Primary ? FindingKind.DrugTierPrimary : FindingKind.DrugTierSecondary);

    /// <summary>"matched by code RxNorm 5487" or "matched by name in the medication text (no code matched)".</summary>
    public static Finding HowMatched(MedicationMatch match)
    {
        Guard.NotNull(match, nameof(match));
        return match.ByName ? Finding.Of(FindingKind.DrugMatchedByName) : Finding.Of(FindingKind.DrugMatchedByCode, Slot.Text("code", match.By));
    }

    /// <summary>
    /// What clinicians usually consider for a drug of this group: review the need, a lower-risk alternative, recheck
    /// sodium; with the group's own caution where stopping abruptly is a hazard (anti-epileptics: seizures;
    /// antidepressants: discontinuation symptoms; common practice).
    /// </summary>
    public static Finding Considerations(MedicationMatch match)
    {
        Guard.NotNull(match, nameof(match));
        var caution = match.Set.Id switch
        {
            "drug-carbamazepine-family" or "drug-other-antiepileptic" => FindingKind.DrugCautionAntiepileptic,
            "drug-ssri" or "drug-snri" or "drug-tricyclic" => FindingKind.DrugCautionAntidepressant,
            "drug-desmopressin" => FindingKind.DrugCautionDesmopressin,
            "drug-chemotherapy" => FindingKind.DrugCautionChemotherapy,
            _ => null,
        };
        return caution is null
            ? Finding.Of(FindingKind.DrugConsider, Name(match))
            : Finding.Of(FindingKind.DrugConsiderWithCaution, Name(match), Slot.Phrase("caution", Finding.Of(caution)));
    }

    /// <summary>What clinicians usually weigh before starting a drug of this group (a draft order: nothing to taper yet).</summary>
    public static Finding ConsiderationsBeforeStarting(MedicationMatch match)
        => Finding.Of(FindingKind.DrugConsiderBeforeStarting, Name(match));

    /// <summary>"citalopram, a selective serotonin reuptake inhibitor (SSRI)," for a summary.</summary>
    public static Finding NameWithGroup(MedicationMatch match)
    {
        Guard.NotNull(match, nameof(match));
        var label = match.Set.Label;
        var vowel = label.Length > 0 && "aeiouAEIOU".Contains(label[0], StringComparison.Ordinal);
        return Finding.Of(vowel ? FindingKind.DrugNameWithGroupAn : FindingKind.DrugNameWithGroupA, Name(match), Group(match.Set));
    }
}
