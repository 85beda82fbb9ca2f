using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.Facts;

/// <summary>FHIR R4 Quantity.comparator: "&lt;" the actual value is less than the stated value; "&gt;=" greater or equal, and so on.</summary>
public class BoundsTests
{
    private static LabResult Result(ValueComparator? comparator, double value) => Some.Lab(Analyte.UrineSodium, value) with { Comparator = comparator };

    // Threshold 30 mmol/L (urine sodium cut-off of the 2014 European guideline): below, at and above each edge.
    [Theory]
    [InlineData(null, 31.0, true)]
    [InlineData(null, 30.0, false)]
    [InlineData(ValueComparator.LessThan, 30.0, false)]     // < 30: never above 30
    [InlineData(ValueComparator.LessThan, 30.1, null)]      // < 30.1: could be 30.05
    [InlineData(ValueComparator.LessOrEqual, 30.0, false)]  // ≤ 30: not above 30
    [InlineData(ValueComparator.LessOrEqual, 31.0, null)]
    [InlineData(ValueComparator.GreaterThan, 30.0, true)]   // > 30: above 30
    [InlineData(ValueComparator.GreaterThan, 29.9, null)]
    [InlineData(ValueComparator.GreaterOrEqual, 30.0, null)] // ≥ 30: could be exactly 30
    [InlineData(ValueComparator.GreaterOrEqual, 30.1, true)]
    public void IsAbove_BoundAgainstThreshold_DecidesOnlyWhenItCan(ValueComparator? comparator, double value, bool? expected)
        => Assert.Equal(expected, Bounds.IsAbove(Result(comparator, value), 30));

    [Theory]
    [InlineData(ValueComparator.LessThan, 135.0, true)]      // < 135: below 135
    [InlineData(ValueComparator.LessThan, 135.1, null)]
    [InlineData(ValueComparator.LessOrEqual, 134.9, true)]
    [InlineData(ValueComparator.LessOrEqual, 135.0, null)]   // ≤ 135: could be exactly 135
    [InlineData(ValueComparator.GreaterThan, 135.0, false)]
    [InlineData(ValueComparator.GreaterOrEqual, 135.0, false)]
    [InlineData(ValueComparator.GreaterOrEqual, 134.9, null)]
    public void IsBelow_BoundAgainstThreshold_DecidesOnlyWhenItCan(ValueComparator comparator, double value, bool? expected)
        => Assert.Equal(expected, Bounds.IsBelow(Result(comparator, value), 135));

    [Theory]
    [InlineData(ValueComparator.LessThan, "below 100")]
    [InlineData(ValueComparator.LessOrEqual, "at or below 100")]
    [InlineData(ValueComparator.GreaterThan, "above 100")]
    [InlineData(ValueComparator.GreaterOrEqual, "at or above 100")]
    public void Describe_Bound_InWords(ValueComparator comparator, string expected)
        => Assert.Equal(expected, Bounds.Describe(Result(comparator, 100)));
}
