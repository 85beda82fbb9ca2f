namespace CdsNatremia.Fhir.Knowledge;

/// <summary>Extension URLs of our own used in the knowledge ValueSets (see profiles/README.md).</summary>
public static class KnowledgeExtensions
{
    /// <summary>Base of our canonical URLs; an operator may host the files elsewhere.</summary>
    public const string Base = "https://cdsnatremia.example.org/fhir";

    /// <summary>Evidence tier of a drug group: "primary" or "secondary".</summary>
    public const string DrugGroupTier = Base + "/StructureDefinition/drug-group-tier";

    /// <summary>Short label of a drug group, as a prescriber reads it.</summary>
    public const string DrugGroupLabel = Base + "/StructureDefinition/drug-group-label";

    /// <summary>Short label of a clinical clue (condition set).</summary>
    public const string ClinicalClueLabel = Base + "/StructureDefinition/clinical-clue-label";
}
