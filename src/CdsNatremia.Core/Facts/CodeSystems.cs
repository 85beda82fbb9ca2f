namespace CdsNatremia.Core.Facts;

/// <summary>Code system URIs, as FHIR R4 names them.</summary>
public static class CodeSystems
{
    /// <summary>LOINC.</summary>
    public const string Loinc = "http://loinc.org";
    /// <summary>RxNorm.</summary>
    public const string RxNorm = "http://www.nlm.nih.gov/research/umls/rxnorm";
    /// <summary>WHO Anatomical Therapeutic Chemical classification.</summary>
    public const string Atc = "http://www.whocc.no/atc";
    /// <summary>SNOMED CT.</summary>
    public const string SnomedCt = "http://snomed.info/sct";
    /// <summary>ICD-10 (WHO).</summary>
    public const string Icd10 = "http://hl7.org/fhir/sid/icd-10";
    /// <summary>ICD-10-CM.</summary>
    public const string Icd10Cm = "http://hl7.org/fhir/sid/icd-10-cm";
    /// <summary>UCUM units.</summary>
    public const string Ucum = "http://unitsofmeasure.org";
}
