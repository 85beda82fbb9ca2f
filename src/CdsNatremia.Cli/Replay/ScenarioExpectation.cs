using System.Text.Json;
using CdsNatremia.Scenarios;

namespace CdsNatremia.Cli.Replay;

/// <summary>
/// Compares a replayed answer with every field of the scenario's manifest expectation (<see cref="ManifestFields"/>
/// says how each is read). A replay passes only when no field fails.
/// </summary>
internal static class ScenarioExpectation
{
    /// <summary>One row per manifest field, in the manifest's order.</summary>
    public static IReadOnlyList<FieldComparison> Compare(Scenario scenario, ReplayResult result)
    {
        ArgumentNullException.ThrowIfNull(scenario);
        ArgumentNullException.ThrowIfNull(result);
        var rows = new List<FieldComparison>();
        if (result.Status != 200)
        {
            rows.Add(new FieldComparison(scenario.Id, "HTTP status", "200", result.Status.ToString(System.Globalization.CultureInfo.InvariantCulture), FieldResult.Fail));
        }

        var answer = new AnswerText(result);
        var nothingToRead = !scenario.ExpectsCard && (scenario.Hook is "patient-view" or "result" ? answer.Assessment is null : answer.Cards.Count == 0);
        foreach (var field in scenario.Expect.EnumerateObject())
        {
            var expected = ManifestFields.Show(field.Value);
            if (field.Name == ManifestFields.ClinicianExpects)
            {
                rows.Add(new FieldComparison(scenario.Id, field.Name, Shorten(expected), "(prose for the reader)", FieldResult.NotApplicable));
                continue;
            }

            if (result.Status != 200)
            {
                rows.Add(new FieldComparison(scenario.Id, field.Name, expected, $"no answer (HTTP {result.Status})", FieldResult.Fail));
                continue;
            }

            if (field.Name != ManifestFields.Card && nothingToRead)
            {
                rows.Add(new FieldComparison(scenario.Id, field.Name, expected, "no card, as expected: nothing to read", FieldResult.NotApplicable));
                continue;
            }

            var check = new FieldCheck(scenario, field.Value, answer);
            var (seen, pass) = ManifestFields.Known.TryGetValue(field.Name, out var compare) && KindMatches(field.Name, field.Value)
                ? compare(check)
                : ManifestFields.Generic(check);
            rows.Add(new FieldComparison(scenario.Id, field.Name, expected, seen, pass ? FieldResult.Pass : FieldResult.Fail));
        }

        return rows;
    }

    /// <summary>The failing rows as sentences ("mentions: expected …, seen …"); empty when the answer matches.</summary>
    public static IReadOnlyList<string> Check(Scenario scenario, ReplayResult result)
        => Compare(scenario, result).Where(r => r.Result == FieldResult.Fail).Select(r => $"{r.Field}: expected {r.Expected}, seen {r.Seen}").ToList();

    // A known field written with an unexpected JSON type is compared generically rather than misread.
    private static bool KindMatches(string field, JsonElement value) => field switch
    {
        ManifestFields.Card or "highRiskOsmoticDemyelination" or "acute" => value.ValueKind is JsonValueKind.True or JsonValueKind.False,
        "mentions" or "setAsideIds" => value.ValueKind == JsonValueKind.Array,
        "glucoseCorrectedSodium" => value.ValueKind == JsonValueKind.Object && value.EnumerateObject().All(p => p.Value.ValueKind == JsonValueKind.Number),
        "indicator" or "sodiumBand" or "tonicity" => value.ValueKind == JsonValueKind.String,
        _ => value.ValueKind == JsonValueKind.Number,
    };

    private static string Shorten(string text) => text.Length <= 60 ? text : text[..57] + "…";
}
