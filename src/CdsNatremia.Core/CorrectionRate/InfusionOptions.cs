using System.ComponentModel.DataAnnotations;

namespace CdsNatremia.Core.CorrectionRate;

/// <summary>
/// Inputs of the infusion prediction: the sodium and potassium content of each infusate (mmol/L) and the fractions of
/// body weight that are total body water. Sodium contents and water fractions are from the project reference sheet
/// (secondary sources); an operator can check and change them here.
/// </summary>
public sealed class InfusionOptions
{
    /// <summary>Sodium in 0.9% sodium chloride, mmol/L. Default 154 (reference sheet, secondary).</summary>
    [Range(100, 200)]
    public double Saline09Sodium { get; set; } = 154;

    /// <summary>Sodium in 3% sodium chloride, mmol/L. Default 513 (reference sheet, secondary).</summary>
    [Range(300, 700)]
    public double Saline3Sodium { get; set; } = 513;

    /// <summary>Sodium in 0.45% sodium chloride, mmol/L. Default 77 (reference sheet, secondary).</summary>
    [Range(50, 100)]
    public double Saline045Sodium { get; set; } = 77;

    /// <summary>Sodium in Ringer's lactate, mmol/L. Default 130 (reference sheet, secondary).</summary>
    [Range(100, 160)]
    public double RingersLactateSodium { get; set; } = 130;

    /// <summary>Potassium in Ringer's lactate, mmol/L. Default 4 (from memory: the usual composition; not on the reference sheet).</summary>
    [Range(0, 20)]
    public double RingersLactatePotassium { get; set; } = 4;

    /// <summary>
    /// Osmolality of Ringer's lactate, mOsm/kg, for the comparison with urine osmolality (desalination check). Default 273
    /// (from memory: the usual stated osmolarity; not on the reference sheet). Sodium chloride solutions use twice their sodium.
    /// </summary>
    [Range(200, 350)]
    public double RingersLactateOsmolality { get; set; } = 273;

    /// <summary>Total body water fraction for children and men under <see cref="OlderFromAge"/>. Default 0.6 (reference sheet, secondary).</summary>
    [Range(0.3, 0.8)]
    public double WaterFractionChildOrYoungerMan { get; set; } = 0.6;

    /// <summary>Total body water fraction for men at or over <see cref="OlderFromAge"/>. Default 0.5 (reference sheet, secondary).</summary>
    [Range(0.3, 0.8)]
    public double WaterFractionOlderMan { get; set; } = 0.5;

    /// <summary>Total body water fraction for women under <see cref="OlderFromAge"/>. Default 0.5 (reference sheet, secondary).</summary>
    [Range(0.3, 0.8)]
    public double WaterFractionYoungerWoman { get; set; } = 0.5;

    /// <summary>Total body water fraction for women at or over <see cref="OlderFromAge"/>. Default 0.45 (reference sheet, secondary).</summary>
    [Range(0.3, 0.8)]
    public double WaterFractionOlderWoman { get; set; } = 0.45;

    /// <summary>Age in years from which the "older" fractions apply. Default 70 (reference sheet, secondary).</summary>
    [Range(40, 100)]
    public int OlderFromAge { get; set; } = 70;

    /// <summary>Age in years below which a patient is a child (fraction 0.6 whatever the sex). Default 18 (common practice: age of adulthood).</summary>
    [Range(1, 21)]
    public int ChildUnderAge { get; set; } = 18;

    /// <summary>
    /// The example weight, kg, used only to show a per-litre figure when the patient has no usable weight. The card labels
    /// it as an example and never treats it as the patient's weight. Default 70 kg (a conventional reference adult; common practice).
    /// </summary>
    [Range(20, 200)]
    public double ExampleWeightKg { get; set; } = 70;

    /// <summary>
    /// A predicted rise within this many mmol/L of the remaining allowance gets a warning. Default 2 mmol/L (design choice,
    /// the same margin as the correction-rate watch).
    /// </summary>
    [Range(0, 10)]
    public double ApproachingWithinMmolPerL { get; set; } = 2;
}
