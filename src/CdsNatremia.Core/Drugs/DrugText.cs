using CdsNatremia.Core.Knowledge;
using CdsNatremia.Core.Text;

namespace CdsNatremia.Core.Drugs;

/// <summary>The shared wording of the drug cards: group and tier, how a drug matched, what clinicians usually consider.</summary>
public static class DrugText
{
    /// <summary>"thiazide or thiazide-like diuretic; primary tier: a well-established cause".</summary>
    public static string GroupAndTier(CodeSet set)
    {
        Guard.NotNull(set, nameof(set));
        var tier = set.Tier == EvidenceTier.Primary
            ? "primary tier: a well-established cause"
            : "secondary tier: another known contributor, with less evidence";
        return $"{Markdown.Escape(set.Label)}; {tier}";
    }

    /// <summary>"matched by RxNorm 5487" or "matched by name in the medication text (no code matched)".</summary>
    public static string HowMatched(MedicationMatch match)
    {
        Guard.NotNull(match, nameof(match));
        return match.ByName
            ? "matched by name in the medication text (no code matched)"
            : "matched by code " + Markdown.Escape(match.By);
    }

    /// <summary>The drug's name as cards print it (escaped).</summary>
    public static string Name(MedicationMatch match) => Markdown.Escape(Guard.NotNull(match, nameof(match)).Ingredient);

    /// <summary>
    /// What clinicians usually consider for a drug of this group: review the need, a lower-risk alternative, recheck
    /// sodium; with the group's own caution where stopping abruptly is a hazard (anti-epileptics: seizures;
    /// antidepressants: discontinuation symptoms; common practice).
    /// </summary>
    public static string Considerations(MedicationMatch match)
    {
        Guard.NotNull(match, nameof(match));
        var text = $"For {Name(match)}, clinicians usually consider whether it is still needed, whether an alternative with a lower risk to sodium would serve, and rechecking sodium after any change";
        var caution = match.Set.Id switch
        {
            "drug-carbamazepine-family" or "drug-other-antiepileptic"
                => "; an anti-epileptic is not stopped abruptly (risk of seizures): discuss any change with the clinician who manages the epilepsy",
            "drug-ssri" or "drug-snri" or "drug-tricyclic"
                => "; an antidepressant is usually tapered rather than stopped abruptly: discuss any change with the prescriber",
            "drug-desmopressin" => "; discuss any change with the clinician who prescribed it",
            "drug-chemotherapy" => "; discuss with the oncology team under local protocol",
            _ => string.Empty,
        };
        return text + caution + ".";
    }

    /// <summary>What clinicians usually weigh before starting a drug of this group (a draft order: nothing to taper yet).</summary>
    public static string ConsiderationsBeforeStarting(MedicationMatch match)
    {
        Guard.NotNull(match, nameof(match));
        return $"Before starting {Name(match)}, clinicians usually weigh the need for it now against the risk to sodium, and consider an alternative with a lower risk to sodium.";
    }

    /// <summary>"citalopram, a selective serotonin reuptake inhibitor (SSRI)," as plain text for a summary.</summary>
    public static string PlainNameWithGroup(MedicationMatch match)
    {
        Guard.NotNull(match, nameof(match));
        var label = match.Set.Label;
        var article = label.Length > 0 && "aeiouAEIOU".Contains(label[0], StringComparison.Ordinal) ? "an" : "a";
        return $"{match.Ingredient}, {article} {label},";
    }
}
