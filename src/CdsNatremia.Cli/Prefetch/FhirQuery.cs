namespace CdsNatremia.Cli.Prefetch;

/// <summary>
/// A relative FHIR query as a prefetch template or a FHIR client writes it: a read ("Patient/123") or a type search
/// ("Observation?patient=123&amp;code=http://loinc.org|2951-2&amp;_sort=-date"). Parameter values are URL-decoded.
/// </summary>
/// <param name="ResourceType">The resource type searched or read.</param>
/// <param name="ReadId">The id for a read; null for a search.</param>
/// <param name="Parameters">Search parameters in order, names with any modifier (e.g. "code:not").</param>
internal sealed record FhirQuery(string ResourceType, string? ReadId, IReadOnlyList<KeyValuePair<string, string>> Parameters)
{
    /// <summary>True for a read of one resource by id.</summary>
    public bool IsRead => ReadId is not null;

    /// <summary>Parses a relative query; throws <see cref="FormatException"/> on anything that is not one.</summary>
    public static FhirQuery Parse(string relative)
    {
        ArgumentNullException.ThrowIfNull(relative);
        var text = relative.Trim().TrimStart('/');
        if (text.Length == 0)
        {
            throw new FormatException("An empty query.");
        }

        var question = text.IndexOf('?', StringComparison.Ordinal);
        var path = question >= 0 ? text[..question] : text;
        var query = question >= 0 ? text[(question + 1)..] : string.Empty;
        var segments = path.Split('/', StringSplitOptions.RemoveEmptyEntries);
        if (segments.Length is 0 or > 2 || !IsResourceType(segments[0]))
        {
            throw new FormatException($"'{path}' is not a resource type or a type/id read.");
        }

        var parameters = new List<KeyValuePair<string, string>>();
        foreach (var pair in query.Split('&', StringSplitOptions.RemoveEmptyEntries))
        {
            var equals = pair.IndexOf('=', StringComparison.Ordinal);
            if (equals <= 0)
            {
                throw new FormatException($"Search parameter '{pair}' has no value.");
            }

            parameters.Add(new(Uri.UnescapeDataString(pair[..equals]), Uri.UnescapeDataString(pair[(equals + 1)..].Replace('+', ' '))));
        }

        return new FhirQuery(segments[0], segments.Length == 2 ? Uri.UnescapeDataString(segments[1]) : null, parameters);
    }

    /// <summary>The query back as relative URL text, values escaped.</summary>
    public override string ToString()
        => IsRead
            ? $"{ResourceType}/{ReadId}"
            : ResourceType + (Parameters.Count == 0 ? string.Empty : "?" + string.Join("&", Parameters.Select(p => Escape(p.Key) + "=" + Escape(p.Value))));

    private static string Escape(string text) => Uri.EscapeDataString(text).Replace("%7C", "|", StringComparison.Ordinal).Replace("%2C", ",", StringComparison.Ordinal).Replace("%3A", ":", StringComparison.Ordinal).Replace("%2F", "/", StringComparison.Ordinal);

    private static bool IsResourceType(string segment)
        => segment.Length > 0 && char.IsAsciiLetterUpper(segment[0]) && segment.All(char.IsAsciiLetter);
}
