using System.Text.Json.Nodes;
using CdsNatremia.Service.Tests.Support;
using Microsoft.IdentityModel.Tokens;

namespace CdsNatremia.Service.Tests.Security;

/// <summary>
/// A start refused for a configuration problem, as an operator sees it: the real process ends with a non-zero exit
/// code and writes one line that names the setting and the fix, never an "Unhandled exception" with a stack trace.
/// </summary>
public sealed class StartupRefusalProcessTests
{
    private static readonly TimeSpan Wait = TimeSpan.FromSeconds(90);
    private static readonly string PseudonymKey = new('k', 48);

    [Fact]
    public async Task Start_ProductionWithoutPseudonymKey_OneLineNamingTheSettingAndExitCode78()
    {
        var refusal = await RefusedAsync("Production", new Dictionary<string, string?>());

        Assert.Contains("Natremia:Audit:PseudonymKey is not configured", refusal, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Start_ProductionWithoutTrustedClients_OneLineNamingTheSetting()
    {
        var refusal = await RefusedAsync("Production", new Dictionary<string, string?> { ["Natremia:Audit:PseudonymKey"] = PseudonymKey });

        Assert.Contains("Natremia:Authentication:TrustedClients is empty", refusal, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Start_InlineJwkWithAPointOffTheCurve_OneLineNamingTheKey()
    {
        using var keys = new TestClientKeys();
        var settings = keys.InlineSettings();
        settings["Natremia:Authentication:TrustedClients:0:Jwks"] = OffCurveJwks(keys);

        var refusal = await RefusedAsync("Development", settings!);

        Assert.Contains("Natremia:Authentication:TrustedClients:0:Jwks key 'test-ec-1'", refusal, StringComparison.Ordinal);
        Assert.Contains("not on the curve P-384", refusal, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("Development", "::::", "is not an absolute http(s) URL")]
    [InlineData("Development", "ftp://ehr.test.example/fhir", "is not an absolute http(s) URL")]
    [InlineData("Production", "http://ehr.test.example/fhir", "must use https outside the Development environment")]
    public async Task Start_AllowedServerEntryUnusable_OneLineNamingTheEntry(string environment, string entry, string expected)
    {
        using var keys = new TestClientKeys();
        var settings = keys.InlineSettings();
        settings["Natremia:Audit:PseudonymKey"] = PseudonymKey;
        settings["Natremia:Fetching:AllowedServers:0"] = "https://ehr.test.example/fhir";
        settings["Natremia:Fetching:AllowedServers:1"] = entry;

        var refusal = await RefusedAsync(environment, settings!);

        Assert.Contains($"Natremia:Fetching:AllowedServers:1 '{entry}' {expected}", refusal, StringComparison.Ordinal);
        Assert.DoesNotContain("AllowedServers:0", refusal, StringComparison.Ordinal);
    }

    /// <summary>The same EC key with y changed in its last byte: well-formed base64url of the right length, but no point on P-384.</summary>
    internal static string OffCurveJwks(TestClientKeys keys)
    {
        var jwks = JsonNode.Parse(keys.PublicJwks(TestClientKeys.EcKid))!;
        var y = Base64UrlEncoder.DecodeBytes((string)jwks["keys"]![0]!["y"]!);
        y[^1] ^= 0x01;
        jwks["keys"]![0]!["y"] = Base64UrlEncoder.Encode(y);
        return jwks.ToJsonString();
    }

    /// <summary>Starts the process, expects it to stop by itself, checks the refusal's form, and returns its one line.</summary>
    private static async Task<string> RefusedAsync(string environment, IReadOnlyDictionary<string, string?> settings)
    {
        await using var service = ServiceProcess.Start(environment, settings);
        var exit = await service.WaitForExitAsync(Wait);

        Assert.True(exit is not null, $"the service kept running; output: {service.StandardOutput}");
        Assert.Equal(78, exit);
        var stderr = service.StandardError.Trim();
        var all = stderr + "\n" + service.StandardOutput;
        Assert.DoesNotContain("Unhandled exception", all, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", all, StringComparison.Ordinal);
        var lines = stderr.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.Single(lines);
        Assert.StartsWith("crit: CdsNatremia.Service refused to start: Natremia:", lines[0], StringComparison.Ordinal);
        return lines[0];
    }
}
