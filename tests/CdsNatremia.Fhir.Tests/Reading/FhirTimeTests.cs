using System.Globalization;
using CdsNatremia.Fhir.Reading;
using Hl7.Fhir.Model;

namespace CdsNatremia.Fhir.Tests.Reading;

/// <summary>
/// The common-form date-time reader (<see cref="FhirTime.TryParseCommon"/>) against the FHIR SDK's own parsing, over
/// every combination of boundary years, calendar days, times, fractions and zones: whatever the common reader accepts,
/// the SDK accepts too (as a dateTime and as an instant), with the same instant and the same offset; and
/// <see cref="FhirTime.From(DataType)"/> gives exactly what the SDK alone gave. Grammar: FHIR R4 datatypes, dateTime and
/// instant (hl7.org/fhir/R4/datatypes.html): seconds, an offset up to ±14:00, Z.
/// </summary>
public class FhirTimeTests
{
    private static readonly string[] Years = ["0001", "1969", "2000", "2024", "2026", "9999", "0000"];
    private static readonly string[] MonthDays = ["01-01", "02-28", "02-29", "02-30", "04-31", "12-31", "00-10", "13-01", "01-00", "01-32"];
    private static readonly string[] Times = ["00:00:00", "08:30:15", "23:59:59", "23:59:60", "24:00:00", "12:60:00"];
    private static readonly string[] Fractions = ["", ".123", ".000", ".1", ".12345", ".123456789"];
    private static readonly string[] Zones = ["Z", "+00:00", "-00:00", "+05:30", "-03:00", "+13:59", "+14:00", "-14:00", "+14:01", "+15:00", "z", "", "+0530"];

    private static IEnumerable<string> Values()
    {
        foreach (var year in Years)
        {
            foreach (var monthDay in MonthDays)
            {
                foreach (var time in Times)
                {
                    foreach (var fraction in Fractions)
                    {
                        foreach (var zone in Zones)
                        {
                            yield return $"{year}-{monthDay}T{time}{fraction}{zone}";
                        }
                    }
                }
            }
        }

        foreach (var odd in new[] { "2026-03-09t08:00:00Z", "2026-03-09 08:00:00Z", "2026-03-09T8:00:00Z", "2026-03-09", "2026-03", "2026", "2026-03-09T08:00Z", "+2026-03-09T08:00:00Z", "2026-03-09T08:00:00+5:30", "２０２６-03-09T08:00:00Z" })
        {
            yield return odd;
        }
    }

    [Fact]
    public void TryParseCommon_EveryBoundaryCombination_AcceptsOnlyWhatTheSdkAcceptsWithTheSameInstantAndOffset()
    {
        var accepted = 0;
        foreach (var value in Values())
        {
            if (!FhirTime.TryParseCommon(value, out var common))
            {
                continue;
            }

            accepted++;
            Assert.True(FhirDateTime.IsValidValue(value), $"{value}: accepted here, not a valid FHIR dateTime for the SDK");
            Assert.True(Instant.IsValidValue(value), $"{value}: accepted here, not a valid FHIR instant for the SDK");
            Assert.True(new FhirDateTime(value).TryToDateTimeOffset(TimeSpan.Zero, out var sdk), $"{value}: the SDK cannot read it as a time");
            Assert.True(common.EqualsExact(sdk), $"{value}: {common:O} here, {sdk:O} by the SDK");
            Assert.True(DateTimeOffset.TryParse(value, CultureInfo.InvariantCulture, DateTimeStyles.None, out var framework) && common.EqualsExact(framework), $"{value}: differs from DateTimeOffset.Parse");
        }

        Assert.True(accepted > 1000, $"only {accepted} values took the common path");
    }

    [Fact]
    public void From_EveryBoundaryCombination_ExactlyWhatTheSdkAloneGives()
    {
        foreach (var value in Values())
        {
            var element = new FhirDateTime(value);
            DateTimeOffset? sdk = element.TryToDateTimeOffset(TimeSpan.Zero, out var parsed) ? parsed : null;

            var mine = FhirTime.From(element);

            Assert.True(Same(sdk, mine), $"{value}: SDK {sdk:O}, FhirTime {mine:O}");
            DateTimeOffset? sdkFromText = FhirDateTime.IsValidValue(value) ? sdk : null;
            Assert.True(Same(sdkFromText, FhirTime.From(value)), $"{value} as text: SDK {sdkFromText:O}, FhirTime {FhirTime.From(value):O}");
        }
    }

    private static bool Same(DateTimeOffset? a, DateTimeOffset? b)
        => a is null ? b is null : b is not null && a.Value.EqualsExact(b.Value);
}
