using System.Buffers;
using System.Net.Http.Headers;
using System.Text.Json;
using BenchmarkDotNet.Attributes;
using CdsNatremia.Service.Hooks;
using Microsoft.Extensions.DependencyInjection;

namespace CdsNatremia.Benchmarks;

/// <summary>
/// (c) The whole typical request handled in process, two ways: the handler path the endpoint runs (parse the body,
/// <see cref="HookHandler"/>, <see cref="CardResponseWriter"/>, write the JSON response), with every component taken
/// from the real host's container; and a POST through the full ASP.NET Core pipeline on an in-memory TestServer
/// (routing, middleware, result serialization; no sockets).
/// </summary>
[MemoryDiagnoser]
public class WholeRequestBenchmarks
{
    private InMemoryService? _service;
    private HookHandler? _handler;
    private CardResponseWriter? _writer;
    private ServiceDefinition? _definition;
    private byte[] _body = [];
    private readonly ArrayBufferWriter<byte> _output = new(64 * 1024);

    [GlobalSetup]
    public void Setup()
    {
        _service = InMemoryService.StartAsync().GetAwaiter().GetResult();
        var services = _service.App.Services;
        _handler = services.GetRequiredService<HookHandler>();
        _writer = services.GetRequiredService<CardResponseWriter>();
        _definition = services.GetRequiredService<ServiceCatalog>().Find(TypicalRequest.ServiceId)
            ?? throw new InvalidOperationException($"The service '{TypicalRequest.ServiceId}' is not in the catalog.");
        _body = TypicalRequest.Utf8(DateTimeOffset.UtcNow);

        // Both paths must produce a card before anything is measured.
        if (HandleInProcess().GetAwaiter().GetResult() == 0 || PostToInMemoryServer().GetAwaiter().GetResult() < 100)
        {
            throw new InvalidOperationException("The typical request produced no card.");
        }
    }

    [GlobalCleanup]
    public void Cleanup() => _service?.DisposeAsync().AsTask().GetAwaiter().GetResult();

    [Benchmark(Description = "Handler path: parse + HookHandler + CardResponseWriter + JSON out")]
    public async Task<int> HandleInProcess()
    {
        using var document = JsonDocument.Parse(_body);
        var outcome = await _handler!.HandleAsync(_definition!, document.RootElement, CancellationToken.None).ConfigureAwait(false);
        if (outcome is not HookOutcome.Cards cards)
        {
            throw new InvalidOperationException($"Unexpected outcome {outcome}.");
        }

        var (body, issued) = _writer!.Write(cards.Items, cards.PatientId, cards.Now);
        _output.ResetWrittenCount();
        using (var json = new Utf8JsonWriter(_output))
        {
            body.WriteTo(json);
        }

        return issued.Count;
    }

    [Benchmark(Description = "POST through the ASP.NET Core pipeline (in-memory TestServer)")]
    public async Task<int> PostToInMemoryServer()
    {
        using var content = new ByteArrayContent(_body);
        content.Headers.ContentType = new MediaTypeHeaderValue("application/json");
        using var response = await _service!.Client.PostAsync(new Uri("/cds-services/" + TypicalRequest.ServiceId, UriKind.Relative), content).ConfigureAwait(false);
        var bytes = await response.Content.ReadAsByteArrayAsync().ConfigureAwait(false);
        if (!response.IsSuccessStatusCode)
        {
            throw new InvalidOperationException($"HTTP {(int)response.StatusCode}: {System.Text.Encoding.UTF8.GetString(bytes)}");
        }

        return bytes.Length;
    }
}
