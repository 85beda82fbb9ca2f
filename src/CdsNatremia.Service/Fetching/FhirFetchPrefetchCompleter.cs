using System.Globalization;
using System.Text.Json;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Fhir.Reading;
using CdsNatremia.Service.Hooks;
using CdsNatremia.Service.Telemetry;
using Microsoft.Extensions.Options;
using Polly.CircuitBreaker;
using Polly.Timeout;

namespace CdsNatremia.Service.Fetching;

/// <summary>
/// Fetches the prefetch keys the EHR did not send from the EHR's FHIR server, all keys at once, inside one time
/// budget. Each key runs the service's own template (tokens filled and URL-encoded) and follows Bundle "next"
/// links on the same server up to the page and entry caps. Every way a fetch can fail becomes a
/// <see cref="PrefetchValueKind.Failed"/> value whose reason says what and why, in words that carry no token; the
/// handler turns a failed required key into HTTP 412 and a failed optional key into "could not use" on the cards.
/// </summary>
internal sealed class FhirFetchPrefetchCompleter : IPrefetchCompleter
{
    private readonly ResilientFhirClient _client;
    private readonly FhirServerAllowlist _allowlist;
    private readonly BundleReader _bundles;
    private readonly FhirFetchOptions _options;
    private readonly TimeProvider _time;
    private readonly ILogger<FhirFetchPrefetchCompleter> _logger;

    public FhirFetchPrefetchCompleter(
        ResilientFhirClient client,
        FhirServerAllowlist allowlist,
        BundleReader bundles,
        IOptions<FhirFetchOptions> options,
        [FromKeyedServices(FetchingRegistration.ClockKey)] TimeProvider time,
        ILogger<FhirFetchPrefetchCompleter> logger)
    {
        _client = client;
        _allowlist = allowlist;
        _bundles = bundles;
        _options = options.Value;
        _time = time;
        _logger = logger;
    }

    public async Task<IReadOnlyList<PrefetchValue>> CompleteAsync(ServiceDefinition service, HookRequest request, IReadOnlyList<string> keys, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(request);
        ArgumentNullException.ThrowIfNull(keys);
        if (keys.Count == 0)
        {
            return [];
        }

        var refusal = Refusal(request);
        if (refusal is not null)
        {
            FetchLog.NotAttempted(_logger, keys.Count, refusal);
            NatremiaTelemetry.RecordFetchRefused(keys.Count);
            return keys.Select(k => Failed(k, $"prefetch '{k}': {refusal}")).ToList();
        }

        var server = request.FhirServer!;
        var deadline = _time.GetUtcNow() + _options.Budget;
        using var budget = new CancellationTokenSource(_options.Budget, _time);
        using var linked = CancellationTokenSource.CreateLinkedTokenSource(budget.Token, cancellationToken);
        var fetches = keys.Select(k => FetchKeyAsync(k, request, server, deadline, linked.Token, cancellationToken)).ToList();
        var values = await Task.WhenAll(fetches).ConfigureAwait(false);
        cancellationToken.ThrowIfCancellationRequested();
        return values;
    }

    private string? Refusal(HookRequest request)
    {
        if (!_options.Enabled)
        {
            return "it was not in prefetch and fetching from the FHIR server is turned off (Natremia:Fetching:Enabled)";
        }

        if (request.FhirServer is null)
        {
            return "it was not in prefetch and the request gave no fhirServer to fetch it from";
        }

        if (request.Authorization is null)
        {
            return "it was not in prefetch and the request gave no fhirAuthorization (access token) for its FHIR server";
        }

        if (!request.Authorization.AccessToken.All(c => c is > ' ' and <= '~'))
        {
            return "not fetched: the access token holds characters an HTTP header cannot carry";
        }

        return _allowlist.Refusal(request.FhirServer);
    }

    private async Task<PrefetchValue> FetchKeyAsync(string key, HookRequest request, Uri server, DateTimeOffset deadline, CancellationToken cancel, CancellationToken aborted)
    {
        var source = $"FHIR server query '{key}'";
        if (!PrefetchKeys.Templates.TryGetValue(key, out var template))
        {
            return Failed(key, $"{source}: not fetched: the service has no query for this key");
        }

        var query = PrefetchQuery.Build(template, request.Context, out var problem);
        if (query is null)
        {
            return Failed(key, $"{source}: {problem}");
        }

        var started = _time.GetTimestamp();
        var baseUrl = FhirServerAllowlist.BaseOf(server);
        var type = PrefetchQuery.ResourceTypeOf(template);
        var isRead = PrefetchQuery.IsRead(template);
        var url = new Uri(server.GetLeftPart(UriPartial.Path).TrimEnd('/') + "/" + query);
        var resources = new List<ParsedResource>();
        var notes = new List<string>();
        var (pages, attempts, status) = (0, 0, 0);
        PrefetchValue? whole = null;
        string? failure = null;
        string outcome;
        while (true)
        {
            FhirGetResult result;
            try
            {
                result = await _client.GetAsync(url, baseUrl, request.Authorization!.AccessToken, deadline, cancel).ConfigureAwait(false);
            }
            catch (OperationCanceledException) when (!aborted.IsCancellationRequested)
            {
                failure = Invariant($"no answer from the FHIR server within the {_options.Budget.TotalMilliseconds:0} ms time budget");
                outcome = "deadline";
                break;
            }
            catch (Exception ex) when (ex is not OperationCanceledException)
            {
                // Defence in depth: whatever else goes wrong on the way to the EHR's server is a failed key, never a 500.
                // Only the exception's type is reported: its message could quote a URL, which names the patient.
                failure = $"the fetch failed unexpectedly ({ex.GetType().Name})";
                outcome = "failed";
                break;
            }

            attempts += result.Attempts;
            status = result.Response?.Status ?? status;
            var page = Interpret(key, type, isRead, result, out failure, out outcome);
            if (page is null)
            {
                break;
            }

            if (isRead || page.Kind is PrefetchValueKind.Failed or PrefetchValueKind.Unusable)
            {
                if (pages == 0)
                {
                    whole = page;
                    pages = 1;
                }
                else
                {
                    failure = string.Join("; ", page.Problems);
                }

                break;
            }

            pages++;
            resources.AddRange(page.Resources);
            notes.AddRange(page.Problems);
            if (resources.Count > _options.MaxEntries || (resources.Count == _options.MaxEntries && page.NextLink is not null))
            {
                resources.RemoveRange(_options.MaxEntries, resources.Count - _options.MaxEntries);
                notes.Add(Invariant($"{source}: only the first {_options.MaxEntries} resources were read (the entry cap); older results were not used"));
                break;
            }

            if (page.NextLink is null)
            {
                break;
            }

            if (pages >= _options.MaxPages)
            {
                notes.Add(Invariant($"{source}: only the first {_options.MaxPages} pages were read (the page cap); older results were not used"));
                break;
            }

            if (!Uri.TryCreate(page.NextLink, UriKind.Absolute, out var next) || !FhirServerAllowlist.SameOrigin(next, server))
            {
                notes.Add($"{source}: the next page link points away from the FHIR server and was not followed; older results were not used");
                break;
            }

            url = next;
        }

        PrefetchValue value;
        if (whole is not null)
        {
            value = whole;
            outcome = whole.Kind switch { PrefetchValueKind.Data => "data", PrefetchValueKind.Empty => "no data", _ => "refused" };
        }
        else if (failure is not null && pages == 0)
        {
            value = Failed(key, $"{source}: {failure}");
        }
        else
        {
            if (failure is not null)
            {
                notes.Add(Invariant($"{source}: paging stopped after page {pages}: {failure}; older results were not used"));
            }

            value = new PrefetchValue(key, resources.Count > 0 ? PrefetchValueKind.Data : PrefetchValueKind.Empty, resources, notes);
            outcome = failure is not null ? "partial" : resources.Count > 0 ? "data" : "no data";
        }

        NatremiaTelemetry.RecordFetch(outcome);
        FetchLog.Fetched(_logger, key, FhirServerAllowlist.OriginOf(server), outcome, status, pages, Math.Max(0, attempts - Math.Max(1, pages)), (long)_time.GetElapsedTime(started).TotalMilliseconds);
        return value;
    }

    /// <summary>Turns one GET's result into a page read by <see cref="BundleReader"/>, or null with the reason it cannot be used.</summary>
    private PrefetchValue? Interpret(string key, string type, bool isRead, FhirGetResult result, out string? failure, out string outcome)
    {
        outcome = "failed";
        if (result.Response is not { } response)
        {
            (failure, outcome) = result.Failure switch
            {
                BrokenCircuitException => (Invariant($"{(result.Attempts == 0 ? "not fetched: " : string.Empty)}calls to this FHIR server are paused after repeated failures (circuit open, for up to {_options.BreakDuration.TotalSeconds:0} s)"), "circuit open"),
                TimeoutRejectedException => (Invariant($"the FHIR server did not answer within {_options.AttemptTimeout.TotalMilliseconds:0} ms ({Attempts(result.Attempts)})"), "attempt time-out"),
                HttpRequestException => ($"the FHIR server could not be reached ({Attempts(result.Attempts)})", "unreachable"),
                _ => ("the connection to the FHIR server broke while its answer was being read", "connection broken"),
            };
            return null;
        }

        failure = response.Status switch
        {
            >= 200 and <= 299 => null,
            >= 300 and <= 399 => Invariant($"the FHIR server answered with a redirect (HTTP {response.Status}); redirects are not followed, so the access token goes only to the allowlisted server"),
            401 => "the FHIR server refused the access token (HTTP 401)",
            403 => $"the FHIR server refused access to {type} (HTTP 403); the access token's scope may not cover it",
            404 when isRead => $"the FHIR server has no such {type} (HTTP 404)",
            429 or 503 when response.RetryAfter is { } wait => Invariant($"the FHIR server is busy (HTTP {response.Status}) and asked for a wait of {wait.TotalSeconds:0.#} s ({Attempts(result.Attempts)}); the {_options.Budget.TotalMilliseconds:0} ms time budget does not allow more"),
            _ when response.IsTransientFailure => Invariant($"the FHIR server answered HTTP {response.Status} ({Attempts(result.Attempts)})"),
            _ => Invariant($"the FHIR server answered HTTP {response.Status}"),
        };
        if (failure is not null)
        {
            return null;
        }

        if (response.Oversize || response.Body is null)
        {
            failure = Invariant($"the FHIR server's answer is larger than the {_options.MaxResponseBytes} byte cap and was not read");
            outcome = "oversize";
            return null;
        }

        if (!IsFhirJson(response.ContentType))
        {
            failure = $"the FHIR server answered with content type '{Clip(response.ContentType ?? "none")}', not FHIR JSON";
            outcome = "not FHIR JSON";
            return null;
        }

        JsonDocument document;
        try
        {
            document = JsonDocument.Parse(response.Body, new JsonDocumentOptions { MaxDepth = 64 });
        }
        catch (JsonException)
        {
            failure = "the FHIR server's answer is not valid JSON";
            outcome = "malformed JSON";
            return null;
        }

        using (document)
        {
            failure = WrongType(document.RootElement, type, isRead);
            if (failure is not null)
            {
                outcome = "wrong resource type";
                return null;
            }

            return _bundles.Read(key, document.RootElement, DataOrigin.FhirServer);
        }
    }

    /// <summary>
    /// A read must return the type asked for, a search a Bundle whose matches are of that type (OperationOutcome
    /// entries and entries marked "include" are allowed). Anything else means the server answered another question.
    /// </summary>
    private static string? WrongType(JsonElement root, string type, bool isRead)
    {
        if (root.ValueKind != JsonValueKind.Object || !root.TryGetProperty("resourceType", out var rt) || rt.ValueKind != JsonValueKind.String)
        {
            return null; // BundleReader explains what it is instead
        }

        var actual = rt.GetString()!;
        var expected = isRead ? type : "Bundle";
        if (actual == "OperationOutcome")
        {
            return null;
        }

        if (actual != expected)
        {
            return $"the FHIR server answered with a {Clip(actual)} where {(isRead ? "a " + type : "a Bundle of " + type)} was asked for";
        }

        if (isRead || !root.TryGetProperty("entry", out var entries) || entries.ValueKind != JsonValueKind.Array)
        {
            return null;
        }

        foreach (var entry in entries.EnumerateArray())
        {
            if (entry.ValueKind != JsonValueKind.Object || !entry.TryGetProperty("resource", out var resource) || resource.ValueKind != JsonValueKind.Object
                || !resource.TryGetProperty("resourceType", out var et) || et.ValueKind != JsonValueKind.String)
            {
                continue;
            }

            var entryType = et.GetString()!;
            var included = entry.TryGetProperty("search", out var search) && search.ValueKind == JsonValueKind.Object
                && search.TryGetProperty("mode", out var mode) && mode.ValueKind == JsonValueKind.String && mode.GetString() == "include";
            if (entryType != type && entryType != "OperationOutcome" && !included)
            {
                return $"the FHIR server answered with a Bundle of {Clip(entryType)} where {type} was asked for";
            }
        }

        return null;
    }

    private static bool IsFhirJson(string? mediaType)
        => mediaType is not null
            && (mediaType.Equals("application/fhir+json", StringComparison.OrdinalIgnoreCase)
                || mediaType.Equals("application/json", StringComparison.OrdinalIgnoreCase)
                || mediaType.Equals("application/json+fhir", StringComparison.OrdinalIgnoreCase));

    private static string Attempts(int count) => count == 1 ? "1 attempt" : Invariant($"{count} attempts");

    private static string Clip(string text)
    {
        var clean = new string(text.Where(c => c is > ' ' and <= '~').Take(60).ToArray());
        return text.Length > 60 ? clean + "…" : clean;
    }

    private static string Invariant(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);

    private static PrefetchValue Failed(string key, string reason) => new(key, PrefetchValueKind.Failed, [], [reason]);
}
