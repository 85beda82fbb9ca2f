using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;

namespace CdsNatremia.Core.CorrectionRate;

/// <summary>Total body water estimate: weight × a fraction chosen by age and sex, with the reason for the fraction.</summary>
/// <param name="WeightKg">The weight used, kg.</param>
/// <param name="Fraction">The fraction of weight that is water.</param>
/// <param name="Why">Why this fraction (and any assumption made), as a phrase.</param>
public sealed record BodyWater(double WeightKg, double Fraction, Finding Why)
{
    /// <summary>Total body water, litres.</summary>
    public double Litres => WeightKg * Fraction;

    /// <summary>
    /// The fraction for a patient (reference sheet, secondary: 0.6 children and men under 70, 0.5 men 70 and over and
    /// women under 70, 0.45 women 70 and over). When sex or age is unknown, the smaller of the possible fractions is used
    /// and said so: a smaller body water predicts a larger change, the cautious side for a fluid that raises sodium.
    /// </summary>
    public static BodyWater Estimate(double weightKg, PatientSex sex, int? age, InfusionOptions options)
    {
        Guard.Finite(weightKg, nameof(weightKg));
        Guard.NotNull(options, nameof(options));
        if (age is { } a && a < options.ChildUnderAge)
        {
            return new(weightKg, options.WaterFractionChildOrYoungerMan, Finding.Of(FindingKind.RateWaterChild, Slot.Count("age", a)));
        }

        var older = age >= options.OlderFromAge;
        Finding Why(string kind) => age is { } known ? Finding.Of(kind, Slot.Count("age", known)) : Finding.Of(kind);
        return (sex, age) switch
        {
            (PatientSex.Male, not null) => new(weightKg, older ? options.WaterFractionOlderMan : options.WaterFractionChildOrYoungerMan, Why(FindingKind.RateWaterMan)),
            (PatientSex.Female, not null) => new(weightKg, older ? options.WaterFractionOlderWoman : options.WaterFractionYoungerWoman, Why(FindingKind.RateWaterWoman)),
            (PatientSex.Male, null) => new(weightKg, options.WaterFractionOlderMan, Why(FindingKind.RateWaterManAgeUnknown)),
            (PatientSex.Female, null) => new(weightKg, options.WaterFractionOlderWoman, Why(FindingKind.RateWaterWomanAgeUnknown)),
            _ => new(
                weightKg,
                older || age is null ? options.WaterFractionOlderWoman : options.WaterFractionYoungerWoman,
                Why(age is null ? FindingKind.RateWaterSexUnknownAgeUnknown : FindingKind.RateWaterSexUnknown)),
        };
    }
}
