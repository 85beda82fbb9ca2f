using CdsNatremia.Core.Facts;
using CdsNatremia.Fhir.Tests.Support;

namespace CdsNatremia.Fhir.Tests.Reading;

/// <summary>The analytes the work-up reads, in each LOINC code and unit, converted to canonical units.</summary>
public class WorkupAnalyteReadingTests
{
    [Theory]
    // Glucose 1 mmol/L = 18.016 mg/dL (molar mass 180.16 g/mol; reference sheet). LOINC 2345-7 and 2339-0 mass, 14749-6 moles (sheet).
    [InlineData("2345-7", "650", "mg/dL", 36.079)]
    [InlineData("2345-7", "100", "mg/dL", 5.551)]
    [InlineData("2339-0", "180.16", "mg/dL", 10.0)]
    [InlineData("14749-6", "5.5", "mmol/L", 5.5)]
    public void Glucose_AnyCodeAndUnit_MmolPerL(string code, string value, string unit, double expected)
    {
        var lab = Assert.Single(Json.Read(Json.Bundle(Json.Observation(id: "g", code: code, value: value, unit: unit))).Labs);
        Assert.Equal(Analyte.Glucose, lab.Analyte);
        Assert.Equal(expected, lab.Value, precision: 3);
    }

    [Theory]
    // Urea nitrogen (BUN, LOINC 3094-0) mg/dL ÷ 2.8014 = urea mmol/L (the "BUN/2.8" of the US formula; reference sheet);
    // urea (LOINC 3091-6, secondary) mg/dL ÷ 6.006 (molar mass 60.06 g/mol: from memory); 22664-7 already mmol/L.
    [InlineData("3094-0", "28", "mg/dL", 9.995)]
    [InlineData("3094-0", "2.8014", "mg/dL", 1.0)]
    [InlineData("3091-6", "60.06", "mg/dL", 10.0)]
    [InlineData("22664-7", "5.7", "mmol/L", 5.7)]
    public void Urea_AnyCodeAndUnit_MmolPerL(string code, string value, string unit, double expected)
    {
        var lab = Assert.Single(Json.Read(Json.Bundle(Json.Observation(id: "u", code: code, value: value, unit: unit))).Labs);
        Assert.Equal(Analyte.Urea, lab.Analyte);
        Assert.Equal(expected, lab.Value, precision: 3);
    }

    [Theory]
    [InlineData("2345-7", "g/L")] // a mass unit the service does not list for glucose: never guessed
    [InlineData("3094-0", "mmol/L")] // urea nitrogen mass code with a molar unit: not guessed either
    [InlineData("2692-2", "mOsm/L")] // osmolarity is not osmolality
    public void WorkupAnalyte_UnknownUnit_SetAsideWithReason(string code, string unit)
    {
        var facts = Json.Read(Json.Bundle(Json.Observation(id: "x", code: code, value: "10", unit: unit)));
        Assert.Empty(facts.Labs);
        Assert.Contains("never guessed", Assert.Single(facts.SetAside).Reason, StringComparison.Ordinal);
    }

    [Theory]
    // Triglyceride mg/dL ÷ 88.57 = mmol/L (as triolein, 885.7 g/mol: from memory); total protein g/dL × 10 = g/L (common practice);
    // cortisol µg/dL × 27.59 = nmol/L (362.46 g/mol: from memory).
    [InlineData("2571-8", "3500", "mg/dL", Analyte.Triglyceride, 39.517)]
    [InlineData("2885-2", "7.2", "g/dL", Analyte.TotalProtein, 72)]
    [InlineData("2143-6", "14.8", "ug/dL", Analyte.Cortisol, 408.332)]
    [InlineData("2695-5", "80", "mOsm/kg", Analyte.UrineOsmolality, 80)]
    public void OtherWorkupAnalytes_Converted(string code, string value, string unit, Analyte analyte, double expected)
    {
        var lab = Assert.Single(Json.Read(Json.Bundle(Json.Observation(id: "o", code: code, value: value, unit: unit))).Labs);
        Assert.Equal(analyte, lab.Analyte);
        Assert.Equal(expected, lab.Value, precision: 3);
        Assert.Equal(unit, lab.OriginalUnit);
    }
}
