using CdsNatremia.Core.Facts;
using CdsNatremia.Fhir.Tests.Support;

namespace CdsNatremia.Fhir.Tests.Reading;

public class ObservationReadingTests
{
    // LOINC codes for sodium in serum/plasma and blood: LOINC group LG11363-5 (reference sheet, verified).
    [Theory]
    [InlineData("2951-2", SpecimenKind.SerumOrPlasma)]
    [InlineData("2947-0", SpecimenKind.Blood)]
    [InlineData("32717-1", SpecimenKind.ArterialBlood)]
    [InlineData("39791-9", SpecimenKind.VenousBlood)]
    [InlineData("39792-7", SpecimenKind.CapillaryBlood)]
    [InlineData("77139-4", SpecimenKind.SerumPlasmaOrBlood)]
    public void SodiumCodes_ReadAsSodiumWithTheirSpecimen(string code, SpecimenKind specimen)
    {
        var lab = Assert.Single(Json.Read(Json.Bundle(Json.Observation(code: code))).Labs);
        Assert.Equal(Analyte.Sodium, lab.Analyte);
        Assert.Equal(specimen, lab.Specimen);
    }

    [Fact]
    public void UrineSodium_IsNeverSerumSodium() // LOINC 2955-3 Sodium [Moles/volume] in Urine (reference sheet)
        => Assert.Equal(Analyte.UrineSodium, Assert.Single(Json.Read(Json.Bundle(Json.Observation(code: "2955-3", value: "45"))).Labs).Analyte);

    [Fact]
    public void TwentyFourHourUrineSodium_SetAsideAsARate() // LOINC 2956-1 is moles/time (reference sheet)
    {
        var facts = Json.Read(Json.Bundle(Json.Observation(code: "2956-1", value: "120", unit: "mmol/(24.h)")));
        Assert.Empty(facts.Labs);
        Assert.Contains("rate", Assert.Single(facts.SetAside).Reason, StringComparison.Ordinal);
    }

    // Sodium is monovalent, so mEq/L = mmol/L (common practice).
    [Theory]
    [InlineData("mmol/L")]
    [InlineData("meq/L")]
    [InlineData("mEq/L")]
    [InlineData("mmol/l")]
    public void SodiumUnits_MmolAndMeqAccepted(string unit)
        => Assert.Equal(124, Assert.Single(Json.Read(Json.Bundle(Json.Observation(unit: unit))).Labs).Value);

    [Theory]
    [InlineData("mg/dL")]
    [InlineData("g/L")]
    [InlineData("%")]
    public void SodiumUnits_OthersSetAsideWithTheUnitNamed(string unit)
    {
        var facts = Json.Read(Json.Bundle(Json.Observation(unit: unit)));
        Assert.Empty(facts.Labs);
        var aside = Assert.Single(facts.SetAside);
        Assert.Contains($"'{unit}'", aside.Reason, StringComparison.Ordinal);
        Assert.Equal("Observation/na-1", aside.Reference);
    }

    [Theory]
    [InlineData("final", true, false)]
    [InlineData("amended", true, false)]
    [InlineData("corrected", true, false)]
    [InlineData("preliminary", true, true)]
    [InlineData("cancelled", false, false)]
    [InlineData("entered-in-error", false, false)]
    [InlineData("registered", false, false)]
    [InlineData("unknown", false, false)]
    public void Status_OnlyResultStatusesCount(string status, bool counts, bool preliminary)
    {
        var facts = Json.Read(Json.Bundle(Json.Observation(status: status)));
        Assert.Equal(counts ? 1 : 0, facts.Labs.Count);
        if (counts)
        {
            Assert.Equal(preliminary, facts.Labs[0].IsPreliminary);
        }
        else
        {
            Assert.Contains(status, Assert.Single(facts.SetAside).Reason, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void AnotherPatientsResult_SetAsideCountedOnlyWithNothingIdentifying()
    {
        var facts = Json.Read(Json.Bundle(Json.Observation(id: "na-other", value: "112", subject: "Patient/someone-else")));
        Assert.Empty(facts.Labs);
        var item = Assert.Single(facts.SetAside);
        Assert.Equal(FactState.NotThisPatient, item.State);
        Assert.DoesNotContain("na-other", item.Reference + item.What + item.Reason, StringComparison.Ordinal); // privacy: no id
        Assert.DoesNotContain("112", item.Reference + item.What + item.Reason, StringComparison.Ordinal);      // privacy: no value
        Assert.Null(item.At);                                                                                  // privacy: no time
        Assert.Equal(1, facts.AboutAnotherPatientCount);
    }

    [Fact]
    public void FutureResult_SetAside()
        => Assert.Contains("future", Assert.Single(Json.Read(Json.Bundle(Json.Observation(effective: "2026-03-11T08:00:00Z"))).SetAside).Reason, StringComparison.Ordinal);

    [Fact]
    public void ImplausibleSodium_SetAside()
        => Assert.Contains("plausible", Assert.Single(Json.Read(Json.Bundle(Json.Observation(value: "12.4"))).SetAside).Reason, StringComparison.Ordinal);

    [Fact]
    public void UnparseableEntry_SetAsideWithoutLosingTheOthers()
    {
        var bad = Json.Observation(id: "bad", value: "\"abc\"");
        var facts = Json.Read(Json.Bundle(bad, Json.Observation(id: "good")));
        Assert.Equal("good", Assert.Single(facts.Labs).ResourceId);
        var mentions = facts.DataNotes.Concat(facts.SetAside.Select(a => a.Reference));
        Assert.Contains(mentions, n => n.Contains("Observation/bad", StringComparison.Ordinal));
    }

    [Fact]
    public void OtherLoincCodes_IgnoredSilently()
    {
        var facts = Json.Read(Json.Bundle(Json.Observation(code: "718-7", value: "13", unit: "g/dL")));
        Assert.Empty(facts.Labs);
        Assert.Empty(facts.SetAside);
    }
}
