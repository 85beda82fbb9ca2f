using System.Net;
using System.Text.Json.Nodes;
using CdsNatremia.Scenarios;

namespace CdsNatremia.Service.Tests.Support;

/// <summary>What identifies a scenario's patient, for the tests that check no log line, span or metric carries it.</summary>
public static class ScenarioPatientData
{
    /// <summary>
    /// Sends every scenario of the library with <paramref name="send"/> (service id, body), requires HTTP 200 for each, and
    /// adds each scenario patient's ids and names to <paramref name="forbidden"/> and sodium values to <paramref name="sodiumValues"/>.
    /// </summary>
    public static async Task SendEveryScenarioAsync(Func<string, string, Task<HttpResponseMessage>> send, List<string> forbidden, HashSet<string> sodiumValues)
    {
        ArgumentNullException.ThrowIfNull(send);
        ArgumentNullException.ThrowIfNull(forbidden);
        ArgumentNullException.ThrowIfNull(sodiumValues);
        foreach (var scenario in ScenarioLibrary.All)
        {
            var (ids, names, values) = Of(scenario);
            forbidden.AddRange(ids);
            forbidden.AddRange(names);
            sodiumValues.UnionWith(values);
            using var response = await send(HookCalls.ServiceFor(scenario.Hook), HookCalls.Request(scenario).ToJsonString());
            Assert.True(response.StatusCode == HttpStatusCode.OK, $"{scenario.Id}: HTTP {(int)response.StatusCode}");
        }
    }

    /// <summary>The patient's ids, names and sodium values in a scenario, read from its Bundle.</summary>
    public static (List<string> Ids, List<string> Names, List<string> SodiumValues) Of(Scenario scenario)
    {
        ArgumentNullException.ThrowIfNull(scenario);
        var ids = new List<string> { scenario.PatientId };
        var names = new List<string>();
        var values = new List<string>();
        foreach (var resource in JsonNode.Parse(scenario.BundleJson)!["entry"]!.AsArray().Select(e => e!["resource"]!))
        {
            if ((string?)resource["resourceType"] == "Patient")
            {
                foreach (var name in resource["name"]?.AsArray() ?? [])
                {
                    names.Add((string)name!["family"]!);
                    names.AddRange(name["given"]?.AsArray().Select(g => (string)g!) ?? []);
                }
            }
            else if ((string?)resource["resourceType"] == "Observation"
                     && resource["code"]?["coding"]?.AsArray().Any(c => (string?)c!["code"] is "2951-2" or "2947-0") == true
                     && resource["valueQuantity"]?["value"] is JsonValue value)
            {
                values.Add(value.ToJsonString());
            }
        }

        return (ids, names, values);
    }
}
