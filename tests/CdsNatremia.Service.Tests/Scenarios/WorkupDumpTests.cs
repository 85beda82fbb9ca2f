using CdsNatremia.Scenarios;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Scenarios;

public class WorkupDumpTests(NatremiaFactory factory) : IClassFixture<NatremiaFactory>
{
    [Fact]
    public async Task Dump()
    {
        var client = factory.CreateClient();
        var sb = new System.Text.StringBuilder();
        foreach (var s in ScenarioLibrary.All)
        {
            var cards = await HookCalls.RunAsync(client, s);
            sb.AppendLine("######## " + s.Id);
            foreach (var c in cards)
            {
                sb.AppendLine("SUMMARY: " + (string)c!["summary"]! + " [" + (string)c["indicator"]! + "]");
                sb.AppendLine((string)c["detail"]!);
                sb.AppendLine("SUGG: " + (c["suggestions"]?.ToJsonString() is { } j ? string.Join(" | ", c["suggestions"]!.AsArray().Select(x => (string)x!["label"]! + ":" + x["isRecommended"])) : ""));
            }
        }
        await File.WriteAllTextAsync("/tmp/workup-details.md", sb.ToString());
        Assert.True(sb.Length > 0);
    }
}
