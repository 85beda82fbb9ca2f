using System.Text.Json;
using CdsNatremia.Fhir.Reading;
using CdsNatremia.Service.Configuration;
using CdsNatremia.Service.Fetching;
using CdsNatremia.Service.Hooks;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Service.Tests.Support;

/// <summary>
/// The fetching part of the service on its own: the real completer, pipelines and HttpClient from the real
/// registration, with settings per test and the fetch clock of the test's choosing (a FakeTimeProvider drives
/// back-off and circuit breaks; the system clock is used where the test needs real network time).
/// Defaults are loosened (5 s budget, 2 s attempts) so that a busy machine cannot fail a test that is not about time.
/// </summary>
public sealed class FetchHarness : IDisposable
{
    public const string Token = "secret-token-7f3a9c";
    public const string PatientId = "fetch-p1";

    private readonly ServiceProvider _provider;

    public FetchHarness(IEnumerable<string> allowed, Dictionary<string, string?>? settings = null, TimeProvider? clock = null, bool development = true)
    {
        var values = new Dictionary<string, string?>(StringComparer.Ordinal)
        {
            ["Natremia:Fetching:Budget"] = "00:00:05",
            ["Natremia:Fetching:AttemptTimeout"] = "00:00:02",
            ["Natremia:Fetching:RetryBaseDelay"] = "00:00:00.010",
        };
        foreach (var (key, value) in settings ?? [])
        {
            values[key] = value;
        }

        var configuration = new ConfigurationBuilder().AddInMemoryCollection(values).Build();
        var services = new ServiceCollection();
        services.AddLogging(b => b.AddProvider(Logs).SetMinimumLevel(LogLevel.Trace));
        services.AddSingleton<ResourceParser>();
        services.AddSingleton<BundleReader>();
        services.AddSingleton(new FhirServerAllowlist(allowed, development));
        services.AddKeyedSingleton(FetchingRegistration.ClockKey, clock ?? TimeProvider.System);
        services.AddFhirFetching(configuration);
        _provider = services.BuildServiceProvider();
        Completer = _provider.GetRequiredService<IPrefetchCompleter>();
        Service = new ServiceCatalog(Options.Create(new NatremiaServiceOptions())).Find("natremia-chart-review")!;
    }

    public CollectingLoggerProvider Logs { get; } = new();

    public IPrefetchCompleter Completer { get; }

    public ServiceDefinition Service { get; }

    public static HookRequest Request(string? fhirServer, string? token = Token, string patientId = PatientId)
    {
        using var context = JsonDocument.Parse($$"""{"userId":"Practitioner/u1","patientId":"{{patientId}}"}""");
        return new HookRequest
        {
            Hook = "patient-view",
            HookInstance = Guid.NewGuid(),
            PatientId = patientId,
            Context = context.RootElement.Clone(),
            Prefetch = new Dictionary<string, JsonElement>(),
            FhirServer = fhirServer is null ? null : new Uri(fhirServer),
            Authorization = token is null ? null : new FhirAuthorization(token, "Bearer", 300, "patient/*.read", "ehr-client"),
        };
    }

    public async Task<PrefetchValue> FetchAsync(string fhirServer, string key, CancellationToken cancellationToken = default)
        => (await Completer.CompleteAsync(Service, Request(fhirServer), [key], cancellationToken)).Single();

    public Task<IReadOnlyList<PrefetchValue>> FetchAsync(HookRequest request, params string[] keys)
        => Completer.CompleteAsync(Service, request, keys, CancellationToken.None);

    public void Dispose() => _provider.Dispose();
}
