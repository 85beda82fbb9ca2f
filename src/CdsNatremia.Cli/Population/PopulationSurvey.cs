using System.Globalization;
using CdsNatremia.Cli.Replay;

namespace CdsNatremia.Cli.Population;

/// <summary>
/// Runs a generated population through a service's patient-view hook (prefetch evaluated from its own templates) and
/// counts the cards by indicator and topic, per 1,000 patients.
/// </summary>
internal static class PopulationSurvey
{
    /// <summary>Surveys the population; <paramref name="progress"/> gets the number of patients done.</summary>
    public static async Task<SurveyReport> RunAsync(HttpClient client, int seed, int count, DateTimeOffset asOf, IProgress<int>? progress, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(client);
        var services = await Discovery.GetAsync(client, cancellationToken).ConfigureAwait(false);
        var service = services.FirstOrDefault(s => s.Hook == "patient-view")
            ?? throw new ToolException(ExitCodes.ServiceError, "Discovery lists no patient-view service.");
        var byIndicator = new SortedDictionary<string, int>(StringComparer.Ordinal);
        var byTopic = new SortedDictionary<string, int>(StringComparer.Ordinal);
        var byBand = new SortedDictionary<string, int>(StringComparer.Ordinal);
        var failures = new SortedDictionary<string, int>(StringComparer.Ordinal);
        int cards = 0, withCards = 0, done = 0;
        foreach (var patient in PopulationGenerator.Generate(seed, count, asOf))
        {
            cancellationToken.ThrowIfCancellationRequested();
            byBand[patient.Band] = byBand.GetValueOrDefault(patient.Band) + 1;
            var input = new ReplayInput
            {
                Name = patient.Id,
                PatientId = patient.Id,
                Resources = Prefetch.FhirSearchEvaluator.ResourcesOf(patient.Bundle),
            };
            var result = await ReplayRunner.RunAsync(client, service, input, PrefetchMode.Evaluate, cancellationToken).ConfigureAwait(false);
            if (result.Status != 200)
            {
                var key = "http-" + result.Status.ToString(CultureInfo.InvariantCulture);
                failures[key] = failures.GetValueOrDefault(key) + 1;
            }

            if (result.Cards.Count > 0)
            {
                withCards++;
            }

            foreach (var card in result.Cards)
            {
                cards++;
                var indicator = (string?)card?["indicator"] ?? "(none)";
                var topic = (string?)card?["source"]?["topic"]?["code"] ?? "(none)";
                byIndicator[indicator] = byIndicator.GetValueOrDefault(indicator) + 1;
                byTopic[topic] = byTopic.GetValueOrDefault(topic) + 1;
            }

            progress?.Report(++done);
        }

        double Per1000(int n) => count == 0 ? 0 : Math.Round(n * 1000.0 / count, 1);
        return new SurveyReport
        {
            Seed = seed,
            Patients = count,
            AsOf = asOf.ToString("yyyy-MM-dd'T'HH:mm:ss'Z'", CultureInfo.InvariantCulture),
            ServiceId = service.Id,
            PatientsWithCards = withCards,
            Cards = cards,
            CardsPer1000 = Per1000(cards),
            Per1000ByIndicator = byIndicator.ToDictionary(kv => kv.Key, kv => Per1000(kv.Value), StringComparer.Ordinal),
            Per1000ByTopic = byTopic.ToDictionary(kv => kv.Key, kv => Per1000(kv.Value), StringComparer.Ordinal),
            PatientsByBand = byBand,
            Failures = failures,
        };
    }
}
