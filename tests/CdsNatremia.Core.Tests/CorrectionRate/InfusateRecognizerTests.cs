using CdsNatremia.Core.CorrectionRate;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Knowledge;

namespace CdsNatremia.Core.Tests.CorrectionRate;

public class InfusateRecognizerTests
{
    // RxNorm 313002 sodium chloride 9 mg/mL injectable solution (fluid-sodium-chloride ValueSet: verified in the HL7 FHIR
    // specification Medication example); ATC B05XA03 sodium chloride (ValueSet: from memory).
    private static readonly CodeSet Fluids = new(
        InfusateRecognizer.FluidSetId, "https://example.org/vs", "1", "intravenous sodium chloride",
        [new CodeRef(CodeSystems.RxNorm, "313002"), new CodeRef(CodeSystems.Atc, "B05XA03")],
        [],
        ["sodium chloride 0.9%", "sodium chloride 3%", "normal saline", "ringer's lactate"]);

    private static MedicationFact Order(string? text, string? route = "intravenous", IReadOnlyList<CodeRef>? codes = null, IReadOnlyList<MedicationIngredient>? ingredients = null)
        => new("MedicationRequest", "d1", codes ?? [], ingredients ?? [], text, MedicationUse.Draft, null, null) { Route = route, VolumeMilliliters = 500 };

    [Theory]
    [InlineData("30 mg/1 mL", InfusateKind.Saline3)] // 3% = 30 mg/mL (3 g per 100 mL, definition of per cent w/v)
    [InlineData("3 g/100 mL", InfusateKind.Saline3)]
    [InlineData("9 mg/mL", InfusateKind.Saline09)] // 0.9% = 9 mg/mL
    [InlineData("4.5 g/1000 mL", InfusateKind.Saline045)] // 0.45% = 4.5 g/L
    [InlineData("0.9 g/100 mL", InfusateKind.Saline09)]
    public void Recognize_ByIngredientStrength(string strength, InfusateKind expected)
    {
        var order = Order("sodium chloride injection", ingredients: [new([new CodeRef(CodeSystems.Atc, "B05XA03")], "sodium chloride", strength)]);
        Assert.Equal(expected, InfusateRecognizer.Recognize(order, Fluids, new InfusionOptions())!.Infusate!.Kind);
    }

    [Theory]
    [InlineData("sodium chloride 3% intravenous solution", InfusateKind.Saline3)]
    [InlineData("0.45% saline with 5% glucose", InfusateKind.Saline045)] // the 5% belongs to glucose
    [InlineData("Normal saline 1 L", InfusateKind.Saline09)]
    [InlineData("half-normal saline", InfusateKind.Saline045)]
    [InlineData("Lactated Ringer's", InfusateKind.RingersLactate)]
    [InlineData("NaCl 30 mg/mL", InfusateKind.Saline3)]
    public void Recognize_ByText(string text, InfusateKind expected)
        => Assert.Equal(expected, InfusateRecognizer.Recognize(Order(text), Fluids, new InfusionOptions())!.Infusate!.Kind);

    [Fact]
    public void Recognize_RxNorm09_WithoutText()
        => Assert.Equal(InfusateKind.Saline09, InfusateRecognizer.Recognize(Order(null, codes: [new CodeRef(CodeSystems.RxNorm, "313002")]), Fluids, new InfusionOptions())!.Infusate!.Kind);

    [Theory]
    [InlineData("oral")]
    [InlineData("by mouth")]
    [InlineData("PO")]
    public void Recognize_OralRoute_NotAnInfusion(string route)
        => Assert.Null(InfusateRecognizer.Recognize(Order("sodium chloride 3%", route), Fluids, new InfusionOptions()));

    [Fact]
    public void Recognize_GlucoseOnly_NotSaline()
        => Assert.Null(InfusateRecognizer.Recognize(Order("glucose 5% intravenous"), Fluids, new InfusionOptions()));

    [Fact]
    public void Recognize_UnknownConcentration_RecognisedWithoutInfusate()
    {
        var recognition = InfusateRecognizer.Recognize(Order("sodium chloride 5% infusion"), Fluids, new InfusionOptions());
        Assert.NotNull(recognition);
        Assert.Null(recognition.Infusate); // never guessed
    }

    [Fact]
    public void Recognize_VeryLongText_AnswersWithoutError()
    {
        var text = "sodium chloride 3% " + new string(' ', 200_000) + "1 mg/" + new string('9', 100_000);
        Assert.Equal(InfusateKind.Saline3, InfusateRecognizer.Recognize(Order(text, route: new string(' ', 100_000) + "x"), Fluids, new InfusionOptions())!.Infusate!.Kind);
    }

    [Fact]
    public void Recognize_NoRoute_AssumedButSaid()
        => Assert.False(InfusateRecognizer.Recognize(Order("sodium chloride 0.9%", route: null), Fluids, new InfusionOptions())!.RouteStated);

    [Fact]
    public void Recognize_InfusateSodiumFromOptions()
    {
        // Infusate sodium (reference sheet, secondary): 0.9% 154, 3% 513, 0.45% 77, Ringer's lactate 130 mmol/L.
        var options = new InfusionOptions();
        Assert.Equal(513, Infusate.Of(InfusateKind.Saline3, options).Sodium);
        Assert.Equal(154, Infusate.Of(InfusateKind.Saline09, options).Sodium);
        Assert.Equal(77, Infusate.Of(InfusateKind.Saline045, options).Sodium);
        Assert.Equal(130, Infusate.Of(InfusateKind.RingersLactate, options).Sodium);
    }
}
