using CdsNatremia.Core.CorrectionRate;
using CdsNatremia.Core.Facts;

namespace CdsNatremia.Core.Tests.CorrectionRate;

public class BodyWaterTests
{
    // Total body water fractions (reference sheet, secondary): 0.6 children and men under 70, 0.5 men 70 and over and
    // women under 70, 0.45 women 70 and over.
    [Theory]
    [InlineData(PatientSex.Male, 69, 0.6)]
    [InlineData(PatientSex.Male, 70, 0.5)]
    [InlineData(PatientSex.Female, 69, 0.5)]
    [InlineData(PatientSex.Female, 70, 0.45)]
    [InlineData(PatientSex.Female, 12, 0.6)] // child
    [InlineData(PatientSex.Male, 17, 0.6)] // child (adult from 18, common practice)
    [InlineData(PatientSex.Female, null, 0.45)] // age unknown: the smaller fraction, the larger predicted change
    [InlineData(PatientSex.Unknown, 40, 0.5)] // sex unknown: the smaller of 0.6 and 0.5
    [InlineData(PatientSex.Unknown, null, 0.45)]
    public void Estimate_FractionByAgeAndSex(PatientSex sex, int? age, double expected)
    {
        var water = BodyWater.Estimate(60, sex, age, new InfusionOptions());
        Assert.Equal(expected, water.Fraction);
        Assert.Equal(60 * expected, water.Litres, 10);
    }
}
