using System.Globalization;
using System.Text.Json.Nodes;

namespace CdsNatremia.Cli.Prefetch;

/// <summary>
/// Evaluates a FHIR query against a set of resources held in memory, the way a FHIR R4 server would for the parameters
/// CDS Hooks prefetch templates use: reads, <c>_id</c>, the patient/subject reference, token parameters (code, status,
/// clinical-status, verification-status, category, intent) with <c>system|code</c> lists and <c>:not</c>, date
/// parameters with eq/ne/lt/gt/le/ge prefixes, <c>_sort</c> (date, _id, _lastUpdated; "-" for descending),
/// <c>_count</c> and <c>_include</c> of a medication. Anything else is reported as unsupported and ignored, as a
/// lenient FHIR server does. Stateless; thread-safe.
/// </summary>
internal static class FhirSearchEvaluator
{
    /// <summary>The element each token parameter reads, by resource type ("*" = any type).</summary>
    private static readonly Dictionary<(string Type, string Param), string> TokenPaths = new()
    {
        [("Observation", "code")] = "code",
        [("Condition", "code")] = "code",
        [("MedicationStatement", "code")] = "medicationCodeableConcept",
        [("MedicationRequest", "code")] = "medicationCodeableConcept",
        [("Medication", "code")] = "code",
        [("Procedure", "code")] = "code",
        [("ServiceRequest", "code")] = "code",
        [("*", "status")] = "status",
        [("Condition", "clinical-status")] = "clinicalStatus",
        [("Condition", "verification-status")] = "verificationStatus",
        [("*", "category")] = "category",
        [("*", "intent")] = "intent",
        [("Patient", "gender")] = "gender",
    };

    /// <summary>The date element(s) of each type's "date"-like parameters.</summary>
    private static readonly Dictionary<(string Type, string Param), string[]> DatePaths = new()
    {
        [("Observation", "date")] = ["effectiveDateTime", "effectivePeriod", "effectiveInstant", "issued"],
        [("MedicationStatement", "effective")] = ["effectiveDateTime", "effectivePeriod"],
        [("MedicationRequest", "authoredon")] = ["authoredOn"],
        [("Condition", "onset-date")] = ["onsetDateTime", "onsetPeriod"],
        [("Condition", "recorded-date")] = ["recordedDate"],
        [("Procedure", "date")] = ["performedDateTime", "performedPeriod"],
        [("*", "_lastUpdated")] = ["meta.lastUpdated"],
    };

    /// <summary>The element the default "date" sort reads for each type.</summary>
    private static readonly Dictionary<string, string> SortDateParam = new(StringComparer.Ordinal)
    {
        ["Observation"] = "date",
        ["MedicationStatement"] = "effective",
        ["MedicationRequest"] = "authoredon",
        ["Condition"] = "recorded-date",
        ["Procedure"] = "date",
    };

    private static readonly string[] DatePrefixes = ["eq", "ne", "lt", "gt", "le", "ge"];

    /// <summary>Evaluates a query against the resources.</summary>
    public static SearchOutcome Evaluate(FhirQuery query, IReadOnlyList<JsonObject> resources)
    {
        ArgumentNullException.ThrowIfNull(query);
        ArgumentNullException.ThrowIfNull(resources);
        var ofType = resources.Where(r => TypeOf(r) == query.ResourceType).ToList();
        if (query.IsRead)
        {
            return new SearchOutcome(ofType.Where(r => IdOf(r) == query.ReadId).Take(1).ToList(), [], null, []);
        }

        var unsupported = new List<string>();
        int? count = null;
        string? sort = null;
        var includes = new List<string>();
        IEnumerable<JsonObject> selected = ofType;
        foreach (var (rawName, value) in query.Parameters)
        {
            var colon = rawName.IndexOf(':', StringComparison.Ordinal);
            var name = colon >= 0 ? rawName[..colon] : rawName;
            var modifier = colon >= 0 ? rawName[(colon + 1)..] : null;
            switch (name)
            {
                case "_count":
                    if (int.TryParse(value, NumberStyles.None, CultureInfo.InvariantCulture, out var n) && n >= 0)
                    {
                        count = n;
                    }
                    else
                    {
                        unsupported.Add($"_count={value}: not a whole number");
                    }

                    continue;
                case "_sort":
                    sort = value;
                    continue;
                case SearchsetBundle.OffsetParameter:
                    continue;
                case "_include":
                    includes.Add(value);
                    continue;
                case "_id":
                    var ids = value.Split(',').ToHashSet(StringComparer.Ordinal);
                    selected = selected.Where(r => ids.Contains(IdOf(r) ?? string.Empty)).ToList();
                    continue;
                case "patient" or "subject" when query.ResourceType != "Patient":
                    selected = selected.Where(r => ReferenceMatches(r["subject"]?["reference"] ?? r["patient"]?["reference"], value)).ToList();
                    continue;
            }

            if (Lookup(TokenPaths, query.ResourceType, name) is { } tokenPath)
            {
                if (modifier is not null and not "not")
                {
                    unsupported.Add($"{rawName}: the :{modifier} modifier needs a terminology server");
                    continue;
                }

                var wanted = value.Split(',').Select(Token.Parse).ToList();
                var negate = modifier == "not";
                selected = selected.Where(r => Tokens(r[tokenPath]).Any(t => wanted.Any(w => w.Matches(t))) != negate).ToList();
                continue;
            }

            if (Lookup(DatePaths, query.ResourceType, name) is { } datePaths)
            {
                var prefix = value.Length > 2 && DatePrefixes.Contains(value[..2]) ? value[..2] : "eq";
                var dateText = value.Length > 2 && DatePrefixes.Contains(value[..2]) ? value[2..] : value;
                if (!FhirDateRange.TryParse(dateText, out var searchRange))
                {
                    unsupported.Add($"{rawName}={value}: not a FHIR date");
                    continue;
                }

                selected = selected.Where(r => DateOf(r, datePaths) is { } range && range.Satisfies(prefix, searchRange)).ToList();
                continue;
            }

            unsupported.Add($"{rawName}: not a search parameter this evaluator knows for {query.ResourceType}; ignored");
        }

        var matches = Sort(selected, sort, query.ResourceType, unsupported);
        var included = Include(matches, includes, resources, unsupported);
        return new SearchOutcome(matches, included, count, unsupported);
    }

    /// <summary>The resources of a FHIR Bundle's entries (a collection, searchset or transaction).</summary>
    public static IReadOnlyList<JsonObject> ResourcesOf(JsonNode bundle)
    {
        ArgumentNullException.ThrowIfNull(bundle);
        return bundle["entry"] is JsonArray entries
            ? entries.Select(e => e?["resource"]).OfType<JsonObject>().ToList()
            : [];
    }

    private static List<JsonObject> Sort(IEnumerable<JsonObject> selected, string? sort, string type, List<string> unsupported)
    {
        var list = selected.OrderBy(r => IdOf(r), StringComparer.Ordinal).ToList();
        if (string.IsNullOrWhiteSpace(sort))
        {
            return list;
        }

        foreach (var raw in sort.Split(',', StringSplitOptions.RemoveEmptyEntries).Reverse())
        {
            var descending = raw.StartsWith('-');
            var field = raw.TrimStart('-');
            Func<JsonObject, string> key;
            if (field == "_id")
            {
                key = r => IdOf(r) ?? string.Empty;
            }
            else if ((field == "date" ? SortDateParam.GetValueOrDefault(type) : field) is { } param && Lookup(DatePaths, type, param) is { } paths)
            {
                key = r => DateOf(r, paths) is { } d ? d.Start.UtcTicks.ToString("D20", CultureInfo.InvariantCulture) : string.Empty;
            }
            else
            {
                unsupported.Add($"_sort={raw}: not a sort this evaluator knows for {type}; ignored");
                continue;
            }

            // Sort keys are applied last-first with stable sorts, so the first key listed wins.
            list = (descending ? list.OrderByDescending(key, StringComparer.Ordinal) : list.OrderBy(key, StringComparer.Ordinal)).ToList();
        }

        return list;
    }

    private static List<JsonObject> Include(List<JsonObject> matches, List<string> includes, IReadOnlyList<JsonObject> all, List<string> unsupported)
    {
        var result = new List<JsonObject>();
        foreach (var include in includes)
        {
            var parts = include.Split(':');
            if (parts.Length < 2 || parts[1] != "medication")
            {
                unsupported.Add($"_include={include}: only <type>:medication is supported; ignored");
                continue;
            }

            foreach (var match in matches.Where(m => TypeOf(m) == parts[0]))
            {
                var reference = (string?)match["medicationReference"]?["reference"];
                var target = all.FirstOrDefault(r => TypeOf(r) == "Medication" && ReferenceMatches(JsonValue.Create(reference), IdOf(r) ?? "\u0000", "Medication"));
                if (target is not null && !result.Contains(target))
                {
                    result.Add(target);
                }
            }
        }

        return result;
    }

    private static T? Lookup<T>(Dictionary<(string Type, string Param), T> table, string type, string param) where T : class
        => table.GetValueOrDefault((type, param)) ?? table.GetValueOrDefault(("*", param));

    private static bool ReferenceMatches(JsonNode? reference, string value, string type = "Patient")
    {
        var text = reference is JsonValue v && v.TryGetValue<string>(out var s) ? s : null;
        if (text is null)
        {
            return false;
        }

        var wantedId = value.Contains('/', StringComparison.Ordinal) ? value[(value.LastIndexOf('/') + 1)..] : value;
        var marker = type + "/";
        var at = text.LastIndexOf(marker, StringComparison.Ordinal);
        if (at < 0 || (at > 0 && text[at - 1] != '/'))
        {
            return false;
        }

        var id = text[(at + marker.Length)..].Split('/')[0];
        return string.Equals(id, wantedId, StringComparison.Ordinal);
    }

    private static IEnumerable<Token> Tokens(JsonNode? node)
    {
        switch (node)
        {
            case JsonValue value when value.TryGetValue<string>(out var code):
                yield return new Token(null, code);
                break;
            case JsonArray array:
                foreach (var token in array.SelectMany(Tokens))
                {
                    yield return token;
                }

                break;
            case JsonObject concept when concept["coding"] is JsonArray codings:
                foreach (var coding in codings.OfType<JsonObject>())
                {
                    yield return new Token((string?)coding["system"], (string?)coding["code"]);
                }

                break;
            case JsonObject coding when coding["code"] is not null:
                yield return new Token((string?)coding["system"], (string?)coding["code"]);
                break;
        }
    }

    private static FhirDateRange? DateOf(JsonObject resource, string[] paths)
    {
        foreach (var path in paths)
        {
            JsonNode? node = resource;
            foreach (var part in path.Split('.'))
            {
                node = node?[part];
            }

            switch (node)
            {
                case JsonValue value when value.TryGetValue<string>(out var text) && FhirDateRange.TryParse(text, out var range):
                    return range;
                case JsonObject period:
                    var hasStart = FhirDateRange.TryParse((string?)period["start"], out var start);
                    var hasEnd = FhirDateRange.TryParse((string?)period["end"], out var end);
                    if (hasStart || hasEnd)
                    {
                        return new FhirDateRange(hasStart ? start.Start : DateTimeOffset.MinValue, hasEnd ? end.End : DateTimeOffset.MaxValue);
                    }

                    break;
            }
        }

        return null;
    }

    internal static string? TypeOf(JsonObject resource) => (string?)resource["resourceType"];

    internal static string? IdOf(JsonObject resource) => (string?)resource["id"];

    /// <summary>A token search value or a resource's coded value: system (null = any / none given) and code.</summary>
    private sealed record Token(string? System, string? Code)
    {
        /// <summary>Parses "system|code", "|code" (no system), "system|" (any code of the system) or "code".</summary>
        public static Token Parse(string text)
        {
            var bar = text.IndexOf('|', StringComparison.Ordinal);
            return bar < 0 ? new Token(null, text) : new Token(text[..bar], bar == text.Length - 1 ? null : text[(bar + 1)..]);
        }

        /// <summary>True when a resource's token (the argument) satisfies this search token.</summary>
        public bool Matches(Token actual)
        {
            if (System is null)
            {
                return Code is not null && string.Equals(Code, actual.Code, StringComparison.Ordinal);
            }

            if (System.Length == 0)
            {
                return actual.System is null && string.Equals(Code, actual.Code, StringComparison.Ordinal);
            }

            return string.Equals(System, actual.System, StringComparison.Ordinal)
                && (Code is null || string.Equals(Code, actual.Code, StringComparison.Ordinal));
        }
    }
}
