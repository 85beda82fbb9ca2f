using CdsNatremia.Core.Facts;
using CdsNatremia.Fhir.Tests.Support;

namespace CdsNatremia.Fhir.Tests.Reading;

/// <summary>How the FHIR layer gives each item its fact state: bounded, superseded, unreadable, another patient's, stopped.</summary>
public class FactStateReadingTests
{
    private static string Sodium(string id, string status, string value, string effective, string extra = "", string comparator = "")
        => $$$"""
        {"resourceType":"Observation","id":"{{{id}}}","status":"{{{status}}}",{{{extra}}}
         "code":{"coding":[{"system":"http://loinc.org","code":"2951-2"}]},
         "subject":{"reference":"Patient/pt-1"},"effectiveDateTime":"{{{effective}}}",
         "valueQuantity":{{{{comparator}}}"value":{{{value}}},"unit":"mmol/L","system":"http://unitsofmeasure.org","code":"mmol/L"}}
        """;

    [Fact]
    public void Read_ResourceOfATypeR4DoesNotDefine_NamedAsNotUsedWithoutItsIdOrValues()
    {
        // FHIR R4 defines a fixed list of resource types; an entry of another type cannot be read, is never dropped in
        // silence, and, since whose it is cannot be told, the note carries nothing of it: no id, no subject, no value.
        const string entry = """
            {"resourceType":"ConditionNote","id":"cond-of-other-77","subject":{"reference":"Patient/other-77"},
             "code":{"text":"secret-diagnosis-text"},"valueInteger":424242}
            """;
        var facts = Json.Read(Json.Bundle(Sodium("na-1", "final", "131", "2026-03-10T08:00:00Z"), entry));
        var note = Assert.Single(facts.DataNotes, n => n.Contains("ConditionNote", StringComparison.Ordinal));
        Assert.Contains("could not be read as FHIR R4", note, StringComparison.Ordinal);
        Assert.DoesNotContain("other-77", note, StringComparison.Ordinal);
        Assert.DoesNotContain("424242", note, StringComparison.Ordinal);
        Assert.DoesNotContain("secret-diagnosis-text", note, StringComparison.Ordinal);
        Assert.Equal(131, Assert.Single(facts.Labs).Value); // the readable entry is still used
    }

    // FHIR R4 Observation.derivedFrom is 0..* Reference and Observation.specimen 0..1 Reference (element definitions);
    // the SDK's lenient parse keeps a wrong shape and only fails when the element is read.
    [Theory]
    [InlineData("\"derivedFrom\":{\"reference\":\"Observation/na-1\"},")]
    [InlineData("\"derivedFrom\":[{\"reference\":5}],")]
    [InlineData("\"specimen\":[{\"reference\":\"Specimen/s1\"}],")]
    public void Read_CorrectionWithALinkOfTheWrongShape_SetAsideAsUninterpretableTheOthersStillRead(string extra)
    {
        var facts = Json.Read(Json.Bundle(
            Sodium("na-1", "final", "125", "2026-03-10T06:00:00Z"),
            Sodium("na-2", "amended", "127", "2026-03-10T08:00:00Z", extra)));

        var aside = Assert.Single(facts.SetAside);
        Assert.Equal("Observation/na-2", aside.Reference);
        Assert.Equal("a value in it could not be interpreted", aside.Reason);
        Assert.Equal(125, Assert.Single(facts.Labs).Value); // the readable result is still used
    }

    // FHIR R4 Quantity.comparator: "<" means the actual value is less than the stated value.
    [Theory]
    [InlineData("<", ValueComparator.LessThan)]
    [InlineData("<=", ValueComparator.LessOrEqual)]
    [InlineData(">", ValueComparator.GreaterThan)]
    [InlineData(">=", ValueComparator.GreaterOrEqual)]
    public void Read_ValueWithComparator_KeptAsBoundNeverAsMeasurement(string comparator, ValueComparator expected)
    {
        var facts = Json.Read(Json.Bundle(Sodium("na-b", "final", "100", "2026-03-10T08:00:00Z", comparator: $"\"comparator\":\"{comparator}\",")));
        Assert.Empty(facts.Labs);
        Assert.Empty(facts.SetAside);
        var bound = Assert.Single(facts.BoundedLabs);
        Assert.Equal(expected, bound.Comparator);
        Assert.Equal(100, bound.Value);
    }

    [Fact]
    public void Read_BoundSetAsideForAnotherReason_DescribedInWordsNotEnumName()
    {
        // The unit check still applies to a bound; its description must read "below 100", never "LessThan100".
        var json = Sodium("na-b", "final", "100", "2026-03-10T08:00:00Z", comparator: "\"comparator\":\"<\",").Replace("mmol/L", "mg/dL", StringComparison.Ordinal);
        var item = Assert.Single(Json.Read(Json.Bundle(json)).SetAside);
        Assert.Contains("below 100", item.What, StringComparison.Ordinal);
        Assert.DoesNotContain("LessThan", item.What, StringComparison.Ordinal);
    }

    // FHIR R4 observation-status: amended/corrected are later versions of a final result; the correction supersedes.
    [Fact]
    public void Read_AmendedAtSameCollectionTime_SupersedesPreliminary()
    {
        var facts = Json.Read(Json.Bundle(
            Sodium("na-pre", "preliminary", "117", "2026-03-10T08:00:00Z"),
            Sodium("na-amd", "amended", "133", "2026-03-10T08:00:00Z")));
        Assert.Equal("na-amd", Assert.Single(facts.Labs).ResourceId);
        var item = Assert.Single(facts.SetAside);
        Assert.Equal(FactState.Superseded, item.State);
        Assert.Equal("Observation/na-pre", item.Reference);
        Assert.Contains("Observation/na-amd", item.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void Read_CorrectedWithSameIdentifierAtDifferentTime_SupersedesFinal()
    {
        const string identifier = "\"identifier\":[{\"system\":\"urn:lab\",\"value\":\"acc-7\"}],";
        var facts = Json.Read(Json.Bundle(
            Sodium("na-1", "final", "117", "2026-03-10T08:00:00Z", identifier),
            Sodium("na-2", "corrected", "131", "2026-03-10T08:05:00Z", identifier)));
        Assert.Equal("na-2", Assert.Single(facts.Labs).ResourceId);
        Assert.Contains("same identifier", Assert.Single(facts.SetAside).Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void Read_AmendedDerivedFromEarlierResult_SupersedesIt()
    {
        var facts = Json.Read(Json.Bundle(
            Sodium("na-1", "final", "117", "2026-03-10T08:00:00Z"),
            Sodium("na-2", "amended", "131", "2026-03-10T09:00:00Z", "\"derivedFrom\":[{\"reference\":\"Observation/na-1\"}],")));
        Assert.Equal("na-2", Assert.Single(facts.Labs).ResourceId);
        Assert.Contains("derivedFrom", Assert.Single(facts.SetAside).Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void Read_TwoFinalResultsHoursApart_NeitherSupersedes()
    {
        // Different collections of a standing order are separate results, even with the same basedOn.
        const string basedOn = "\"basedOn\":[{\"reference\":\"ServiceRequest/q6h\"}],";
        var facts = Json.Read(Json.Bundle(
            Sodium("na-1", "final", "117", "2026-03-10T02:00:00Z", basedOn),
            Sodium("na-2", "amended", "121", "2026-03-10T08:00:00Z", basedOn)));
        Assert.Equal(2, facts.Labs.Count);
        Assert.Empty(facts.SetAside);
    }

    [Fact]
    public void Read_EntryThatDoesNotParse_SetAsideAsUnreadableSodiumWithItsTime()
    {
        // 1e400 is beyond any decimal: the entry cannot be parsed, but its code and time still say "a newer sodium exists".
        var facts = Json.Read(Json.Bundle(Sodium("na-big", "final", "1e400", "2026-03-10T09:00:00Z")));
        var item = Assert.Single(facts.SetAside);
        Assert.Equal(FactState.Unreadable, item.State);
        Assert.True(item.Analyte == Analyte.Sodium, item.Reference + " " + item.What + " " + item.Reason);
        Assert.Equal(new DateTimeOffset(2026, 3, 10, 9, 0, 0, TimeSpan.Zero), item.At);
    }

    [Fact]
    public void Read_WithdrawnResult_StateAbsentNotUnreadable()
        => Assert.Equal(FactState.Absent, Assert.Single(Json.Read(Json.Bundle(Json.Observation(status: "entered-in-error"))).SetAside).State);

    [Fact]
    public void Read_AnotherPatientsConditionAndMedicine_CountedOnly()
    {
        var facts = Json.Read(Json.Bundle(
            """{"resourceType":"Condition","id":"c-x","subject":{"reference":"Patient/other-99"},"code":{"text":"heart failure"}}""",
            """{"resourceType":"MedicationStatement","id":"m-x","status":"active","subject":{"reference":"Patient/other-99"},"medicationCodeableConcept":{"text":"hydrochlorothiazide"}}""",
            """{"resourceType":"Patient","id":"other-99"}"""));
        Assert.Empty(facts.Conditions);
        Assert.Empty(facts.Medications);
        Assert.Equal(3, facts.AboutAnotherPatientCount);
        Assert.All(facts.SetAside, i => Assert.DoesNotContain("other-99", i.Reference + i.What + i.Reason, StringComparison.Ordinal));
    }

    [Theory]
    [InlineData("stopped")]
    [InlineData("completed")]
    public void Read_StoppedStatement_KeptApartWithItsEnd(string status)
    {
        var facts = Json.Read(Json.Bundle($$$"""
            {"resourceType":"MedicationStatement","id":"m-1","status":"{{{status}}}","subject":{"reference":"Patient/pt-1"},
             "medicationCodeableConcept":{"text":"hydrochlorothiazide 25 mg"},
             "effectivePeriod":{"start":"2026-02-01","end":"2026-03-06"}}
            """));
        Assert.Empty(facts.Medications);
        var stopped = Assert.Single(facts.StoppedMedications);
        Assert.Equal(MedicationUse.Stopped, stopped.Use);
        Assert.Equal(new DateTimeOffset(2026, 3, 6, 0, 0, 0, TimeSpan.Zero), stopped.EndedAt);
    }

    [Fact]
    public void Read_MedicationReferenceNotResolved_ProductUnreadableWithItsText()
    {
        var facts = Json.Read(Json.Bundle("""
            {"resourceType":"MedicationStatement","id":"m-2","status":"active","subject":{"reference":"Patient/pt-1"},
             "medicationReference":{"reference":"Medication/med-missing","display":"Amlozide combination tablet"}}
            """));
        var medicine = Assert.Single(facts.Medications);
        Assert.NotNull(medicine.ProductUnreadable);
        Assert.Equal("Amlozide combination tablet", medicine.Text);
    }

    [Fact]
    public void Assemble_APrefetchValueThatCouldNotBeUsed_ItsReasonSaidOnceAsUnavailableFurtherProblemsAsNotes()
    {
        var weight = new CdsNatremia.Fhir.Reading.PrefetchValue("weight", CdsNatremia.Fhir.Reading.PrefetchValueKind.Failed, [],
            ["prefetch 'weight': it was not in prefetch", "the FHIR server answered 404"]);

        var facts = new CdsNatremia.Fhir.Reading.FactsAssembler(new CdsNatremia.Core.Sodium.SodiumReadingOptions())
            .Assemble(Json.PatientId, Json.Now, [weight], []).Facts;

        Assert.Equal("prefetch 'weight': it was not in prefetch", facts.Unavailable["weight"]);
        Assert.DoesNotContain("prefetch 'weight': it was not in prefetch", facts.DataNotes);
        Assert.Contains("the FHIR server answered 404", facts.DataNotes);
    }
}
