using System.Globalization;
using System.Text.Json;
using CdsNatremia.Scenarios;

namespace CdsNatremia.Cli.Commands;

/// <summary>The manifest the scenarios command writes: one entry per scenario with its files and expectation.</summary>
internal static class ScenarioManifest
{
    public static object Describe(IReadOnlyList<Scenario> scenarios, TimeSpan shift, DateTimeOffset asOf)
    {
        ArgumentNullException.ThrowIfNull(scenarios);
        return new
        {
            asOf = asOf.ToString("yyyy-MM-dd'T'HH:mm:ss'Z'", CultureInfo.InvariantCulture),
            anchor = ScenarioLibrary.Anchor.ToString("yyyy-MM-dd'T'HH:mm:ss'Z'", CultureInfo.InvariantCulture),
            shiftHours = Math.Round(shift.TotalHours, 3),
            scenarios = scenarios.Select(s => new
            {
                id = s.Id,
                title = s.Title,
                hook = s.Hook,
                patientId = s.PatientId,
                story = s.Story,
                clinicianExpects = s.ClinicianExpects,
                bundleFile = s.Id + ".bundle.json",
                draftOrdersFile = s.DraftOrdersJson is null ? null : s.Id + ".draft-orders.json",
                selections = s.Selections.Count > 0 ? s.Selections : null,
                newResultIds = s.NewResultIds.Count > 0 ? s.NewResultIds : null,
                expect = JsonSerializer.Deserialize<JsonElement>(s.Expect.GetRawText()),
            }).ToList(),
        };
    }
}
