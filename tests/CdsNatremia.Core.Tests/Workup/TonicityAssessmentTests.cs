using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Tests.Support;
using CdsNatremia.Core.Workup;

namespace CdsNatremia.Core.Tests.Workup;

public class TonicityAssessmentTests
{
    private static readonly WorkupOptions Defaults = new();

    [Theory]
    // Hypotonic: effective osmolality < 275 mOsm/kg (SIADH criteria, reference sheet, verified).
    // Hypertonic: total osmolality > 295 mOsm/kg (upper edge of the 275–295 reference range: common practice).
    [InlineData(274.9, 274.9, Tonicity.Hypotonic)]
    [InlineData(275, 275, Tonicity.Isotonic)]
    [InlineData(275.1, 280, Tonicity.Isotonic)]
    [InlineData(290, 295, Tonicity.Isotonic)]
    [InlineData(290, 295.1, Tonicity.Hypertonic)]
    [InlineData(261.9, 279, Tonicity.Hypotonic)] // a raised urea lifts total, not effective, osmolality (scenario 07; common practice)
    [InlineData(260, 310, Tonicity.Hypotonic)]
    public void Classify_BoundaryTable(double effective, double total, Tonicity expected)
        => Assert.Equal(expected, TonicityAssessment.Classify(effective, total, Defaults));

    [Fact]
    public void Classify_NothingKnown_Unknown()
        => Assert.Equal(Tonicity.Unknown, TonicityAssessment.Classify(null, null, Defaults));

    [Fact]
    public void Classify_EffectiveNotLowButTotalUnknown_Unknown()
        => Assert.Equal(Tonicity.Unknown, TonicityAssessment.Classify(280, null, Defaults));

    [Fact]
    public void Compute_MeasuredPresent_PreferredOverCalculated()
    {
        var t = TonicityAssessment.Compute(Some.Sodium(129), Some.Lab(Analyte.SerumOsmolality, 288), Some.Lab(Analyte.Glucose, 6.1), Some.Lab(Analyte.Urea, 5), Defaults);

        Assert.Equal(OsmolalityMethod.Measured, t.Method);
        Assert.Equal(Tonicity.Isotonic, t.Band);
        Assert.Equal(283, t.Effective!.Value, precision: 6);
        Assert.Equal(269.1, t.Calculated!.Value, precision: 6); // 2 × 129 + 6.1 + 5 (reference sheet formula)
        Assert.Equal(18.9, t.Gap!.Value, precision: 6);
        Assert.True(t.GapIsHigh); // > 10 mOsm/kg abnormal (reference sheet)
    }

    [Theory]
    // Osmolal gap above 10 mOsm/kg is abnormal (reference sheet, secondary): 10 is not flagged, 10.1 is.
    [InlineData(10, false)]
    [InlineData(10.1, true)]
    [InlineData(9.9, false)]
    public void Compute_GapBoundary(double gap, bool flagged)
    {
        var calculated = (2 * 130.0) + 5 + 5;
        var t = TonicityAssessment.Compute(Some.Sodium(130), Some.Lab(Analyte.SerumOsmolality, calculated + gap), Some.Lab(Analyte.Glucose, 5), Some.Lab(Analyte.Urea, 5), Defaults);
        Assert.Equal(flagged, t.GapIsHigh);
    }

    [Fact]
    public void Compute_NoMeasured_CalculatedWithEffective()
    {
        var t = TonicityAssessment.Compute(Some.Sodium(124), null, Some.Lab(Analyte.Glucose, 5.8), Some.Lab(Analyte.Urea, 5.7), Defaults);

        Assert.Equal(OsmolalityMethod.Calculated, t.Method);
        Assert.Equal(259.5, t.Calculated!.Value, precision: 6);
        Assert.Equal(253.8, t.Effective!.Value, precision: 6); // 2 × Na + glucose: urea excluded
        Assert.Equal(Tonicity.Hypotonic, t.Band);
        Assert.Null(t.Gap);
    }

    [Fact]
    public void Compute_NoMeasuredNoGlucose_Unknown()
    {
        var t = TonicityAssessment.Compute(Some.Sodium(124), null, null, Some.Lab(Analyte.Urea, 5.7), Defaults);
        Assert.Equal(OsmolalityMethod.None, t.Method);
        Assert.Equal(Tonicity.Unknown, t.Band);
    }

    [Fact]
    public void Compute_GlucoseAndBunReportedInMgPerDl_UsUnitForm()
    {
        var glucose = Some.Lab(Analyte.Glucose, 650 / 18.016) with { OriginalValue = 650, OriginalUnit = "mg/dL", LoincCode = "2345-7" };
        var bun = Some.Lab(Analyte.Urea, 28 / 2.8014) with { OriginalValue = 28, OriginalUnit = "mg/dL", LoincCode = "3094-0" };
        var ureaMass = bun with { LoincCode = "3091-6" }; // urea (not urea nitrogen) in mg/dL: no "BUN/2.8" form

        Assert.True(TonicityAssessment.Compute(Some.Sodium(128), null, glucose, bun, Defaults).ReportedInUsUnits);
        Assert.False(TonicityAssessment.Compute(Some.Sodium(128), null, glucose, ureaMass, Defaults).ReportedInUsUnits);
        Assert.False(TonicityAssessment.Compute(Some.Sodium(128), null, Some.Lab(Analyte.Glucose, 36.1), bun, Defaults).ReportedInUsUnits);
    }

    [Theory]
    // High glucose for the correction: ≥ 11.1 mmol/L (200 mg/dL, common practice).
    [InlineData(11.0, false)]
    [InlineData(11.1, true)]
    public void Compute_HighGlucoseBoundary(double glucose, bool high)
        => Assert.Equal(high, TonicityAssessment.Compute(Some.Sodium(128), null, Some.Lab(Analyte.Glucose, glucose), null, Defaults).GlucoseIsHigh);
}
