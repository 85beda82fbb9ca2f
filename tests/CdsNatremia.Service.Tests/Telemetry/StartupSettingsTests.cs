using CdsNatremia.Service.Hosting;
using CdsNatremia.Service.Tests.Support;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Service.Tests.Telemetry;

/// <summary>Telemetry and shutdown settings that cannot work stop the start naming the setting; valid ones reach the host.</summary>
[Collection(TelemetryCollection.Name)]
public sealed class StartupSettingsTests
{
    [Theory]
    [InlineData("Natremia:Telemetry:OtlpEndpoint", "ftp://collector.example:21", "OtlpEndpoint")]
    [InlineData("Natremia:Telemetry:OtlpProtocol", "udp", "OtlpProtocol")]
    [InlineData("Natremia:Telemetry:MetricsPath", "/cds-services/metrics", "MetricsPath")]
    [InlineData("Natremia:Telemetry:MetricsPath", "metrics", "MetricsPath")]
    [InlineData("Natremia:Telemetry:MetricsPort", "70000", "MetricsPort")]
    [InlineData("Natremia:Shutdown:ReadinessDelay", "00:05:00", "ReadinessDelay")]
    [InlineData("Natremia:Shutdown:DrainTimeout", "00:00:00", "DrainTimeout")]
    public async Task Startup_SettingThatCannotWork_RefusedNamingIt(string key, string value, string named)
    {
        await using var factory = NatremiaFactory.With(new() { [key] = value });
        var message = Exceptions.AllMessages(Assert.ThrowsAny<Exception>(() => factory.CreateClient()));
        Assert.Contains(named, message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Startup_ShutdownSettings_HostBudgetIsDelayPlusDrainPlusFlush()
    {
        await using var factory = NatremiaFactory.With(new() { ["Natremia:Shutdown:ReadinessDelay"] = "00:00:07", ["Natremia:Shutdown:DrainTimeout"] = "00:00:11" });
        factory.CreateClient();
        var host = factory.Services.GetRequiredService<IOptions<HostOptions>>().Value;
        Assert.Equal(TimeSpan.FromSeconds(7 + 11) + ShutdownOptions.FlushAllowance, host.ShutdownTimeout);
        Assert.False(factory.Services.GetRequiredService<ShutdownState>().Draining);
    }
}
