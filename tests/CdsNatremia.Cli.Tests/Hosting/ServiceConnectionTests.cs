using CdsNatremia.Cli.Commands;
using CdsNatremia.Cli.Hosting;
using CdsNatremia.Service.Audit;

namespace CdsNatremia.Cli.Tests.Hosting;

/// <summary>The toolkit's connection to a service marks every request as test traffic.</summary>
public class ServiceConnectionTests
{
    [Fact]
    public async Task OpenAsync_AnyTarget_EveryRequestCarriesTheTestTrafficMarker()
    {
        await using var connection = await ServiceConnection.OpenAsync(new TargetSettings { Url = "http://127.0.0.1:5080" }, null, CancellationToken.None);
        Assert.Equal([TestTraffic.Value], connection.Client.DefaultRequestHeaders.GetValues(TestTraffic.Header));
    }
}
