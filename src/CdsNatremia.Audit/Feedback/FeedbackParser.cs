using System.Globalization;
using System.Text.Json;
using CdsNatremia.Audit.Records;

namespace CdsNatremia.Audit.Feedback;

/// <summary>
/// Reads and validates a CDS Hooks 2.0 feedback body: <c>{"feedback":[{card, outcome, acceptedSuggestions,
/// overrideReason, outcomeTimestamp}]}</c>. Every problem is reported with its JSON path; one bad entry refuses the
/// whole request (all or nothing). Unknown members are refused (only "extension" is reserved by the standard for
/// additions), so a misspelt field name is a clear 400 rather than silently lost data.
/// </summary>
public static class FeedbackParser
{
    /// <summary>Most entries accepted in one request.</summary>
    public const int MaxEntries = 100;

    /// <summary>Longest userComment accepted, in characters.</summary>
    public const int MaxCommentLength = 2000;

    /// <summary>Longest Coding system, code or display accepted, in characters.</summary>
    public const int MaxCodingLength = 512;

    /// <summary>How far after the service's clock an outcomeTimestamp may lie (clock skew between EHR and service).</summary>
    public static readonly TimeSpan AllowedClockSkew = TimeSpan.FromMinutes(5);

    private static readonly string[] TimestampFormats =
    [
        "yyyy-MM-dd'T'HH:mm:ssK",
        "yyyy-MM-dd'T'HH:mm:ss.FFFFFFFK",
    ];

    /// <summary>Parses a body; returns the entries, or null with the problems.</summary>
    /// <param name="body">The request body.</param>
    /// <param name="now">The service's clock, to refuse timestamps in the future.</param>
    /// <param name="problems">The problems found (empty when the body is valid).</param>
    public static IReadOnlyList<FeedbackEntry>? Parse(JsonElement body, DateTimeOffset now, out IReadOnlyList<string> problems)
    {
        var found = new List<string>();
        problems = found;
        if (body.ValueKind != JsonValueKind.Object)
        {
            found.Add("The request body must be a JSON object with a 'feedback' array.");
            return null;
        }

        Unknown(body, string.Empty, found, "feedback", "extension");
        if (!body.TryGetProperty("feedback", out var array))
        {
            found.Add("'feedback' is required.");
            return null;
        }

        if (array.ValueKind != JsonValueKind.Array)
        {
            found.Add("'feedback' must be an array.");
            return null;
        }

        var count = array.GetArrayLength();
        if (count == 0)
        {
            found.Add("'feedback' must hold at least one entry.");
            return null;
        }

        if (count > MaxEntries)
        {
            found.Add($"'feedback' holds {count} entries; at most {MaxEntries} are accepted per request.");
            return null;
        }

        var entries = new List<FeedbackEntry>();
        var index = 0;
        foreach (var item in array.EnumerateArray())
        {
            var entry = Entry(item, $"feedback[{index}]", now, found);
            if (entry is not null)
            {
                entries.Add(entry);
            }

            index++;
        }

        return found.Count == 0 ? entries : null;
    }

    private static FeedbackEntry? Entry(JsonElement item, string path, DateTimeOffset now, List<string> problems)
    {
        if (item.ValueKind != JsonValueKind.Object)
        {
            problems.Add($"'{path}' must be an object.");
            return null;
        }

        var before = problems.Count;
        Unknown(item, path + ".", problems, "card", "outcome", "acceptedSuggestions", "overrideReason", "outcomeTimestamp", "extension");
        var card = Uuid(item, path, "card", problems);
        var outcomeText = RequiredString(item, path, "outcome", problems);
        FeedbackOutcome? outcome = outcomeText switch
        {
            null => null,
            "accepted" => FeedbackOutcome.Accepted,
            "overridden" => FeedbackOutcome.Overridden,
            _ => null,
        };
        if (outcomeText is not null && outcome is null)
        {
            problems.Add($"'{path}.outcome' must be 'accepted' or 'overridden' (got '{Clip(outcomeText)}').");
        }

        var suggestions = AcceptedSuggestions(item, path, outcome, problems);
        var (reason, comment) = OverrideReason(item, path, outcome, problems);
        var timestamp = Timestamp(item, path, now, problems);
        if (problems.Count > before || card is null || outcome is null || timestamp is null)
        {
            return null;
        }

        return new FeedbackEntry
        {
            Card = card.Value,
            Outcome = outcome.Value,
            AcceptedSuggestions = suggestions,
            OverrideReason = reason,
            UserComment = comment,
            OutcomeTimestamp = timestamp.Value,
        };
    }

    private static List<Guid> AcceptedSuggestions(JsonElement item, string path, FeedbackOutcome? outcome, List<string> problems)
    {
        var result = new List<Guid>();
        var name = path + ".acceptedSuggestions";
        if (!item.TryGetProperty("acceptedSuggestions", out var array))
        {
            if (outcome == FeedbackOutcome.Accepted)
            {
                problems.Add($"'{name}' is required when the outcome is 'accepted'.");
            }

            return result;
        }

        if (outcome == FeedbackOutcome.Overridden)
        {
            problems.Add($"'{name}' is allowed only when the outcome is 'accepted'.");
            return result;
        }

        if (array.ValueKind != JsonValueKind.Array)
        {
            problems.Add($"'{name}' must be an array of {{\"id\": suggestion uuid}} objects.");
            return result;
        }

        if (array.GetArrayLength() == 0)
        {
            problems.Add($"'{name}' must name at least one accepted suggestion.");
            return result;
        }

        if (array.GetArrayLength() > MaxEntries)
        {
            problems.Add($"'{name}' holds more than {MaxEntries} suggestions.");
            return result;
        }

        var index = 0;
        foreach (var element in array.EnumerateArray())
        {
            var at = $"{name}[{index++}]";
            if (element.ValueKind != JsonValueKind.Object)
            {
                problems.Add($"'{at}' must be an object with an 'id'.");
                continue;
            }

            Unknown(element, at + ".", problems, "id");
            if (Uuid(element, at, "id", problems) is { } id)
            {
                if (result.Contains(id))
                {
                    problems.Add($"'{at}.id' repeats suggestion {id}.");
                }
                else
                {
                    result.Add(id);
                }
            }
        }

        return result;
    }

    private static (ReasonCoding? Reason, string? Comment) OverrideReason(JsonElement item, string path, FeedbackOutcome? outcome, List<string> problems)
    {
        var name = path + ".overrideReason";
        if (!item.TryGetProperty("overrideReason", out var reasonObject))
        {
            return (null, null);
        }

        if (outcome == FeedbackOutcome.Accepted)
        {
            problems.Add($"'{name}' is allowed only when the outcome is 'overridden'.");
            return (null, null);
        }

        if (reasonObject.ValueKind != JsonValueKind.Object)
        {
            problems.Add($"'{name}' must be an object with 'reason' (a Coding) and/or 'userComment'.");
            return (null, null);
        }

        Unknown(reasonObject, name + ".", problems, "reason", "userComment");
        var hasReason = reasonObject.TryGetProperty("reason", out var coding);
        var hasComment = reasonObject.TryGetProperty("userComment", out var commentElement);
        if (!hasReason && !hasComment)
        {
            problems.Add($"'{name}' must carry 'reason' and/or 'userComment' (leave overrideReason out when there is neither).");
            return (null, null);
        }

        ReasonCoding? reason = null;
        if (hasReason)
        {
            if (coding.ValueKind != JsonValueKind.Object)
            {
                problems.Add($"'{name}.reason' must be a Coding object with 'system' and 'code'.");
            }
            else
            {
                Unknown(coding, name + ".reason.", problems, "system", "code", "display");
                var system = RequiredString(coding, name + ".reason", "system", problems, MaxCodingLength);
                var code = RequiredString(coding, name + ".reason", "code", problems, MaxCodingLength);
                var display = OptionalString(coding, name + ".reason", "display", problems, MaxCodingLength);
                if (system is not null && !Uri.TryCreate(system, UriKind.Absolute, out _))
                {
                    problems.Add($"'{name}.reason.system' must be an absolute URI (got '{Clip(system)}').");
                    system = null;
                }

                if (code is not null && code.Any(char.IsWhiteSpace))
                {
                    problems.Add($"'{name}.reason.code' must not contain spaces.");
                    code = null;
                }

                if (system is not null && code is not null)
                {
                    reason = new ReasonCoding(system, code, display);
                }
            }
        }

        var comment = hasComment ? OptionalString(reasonObject, name, "userComment", problems, MaxCommentLength) : null;
        return (reason, comment);
    }

    private static DateTimeOffset? Timestamp(JsonElement item, string path, DateTimeOffset now, List<string> problems)
    {
        var text = RequiredString(item, path, "outcomeTimestamp", problems);
        if (text is null)
        {
            return null;
        }

        if (!DateTimeOffset.TryParseExact(text, TimestampFormats, CultureInfo.InvariantCulture, DateTimeStyles.None, out var value)
            || !(text.EndsWith('Z') || text.Length > 6 && text[^6] is '+' or '-'))
        {
            problems.Add($"'{path}.outcomeTimestamp' must be an ISO 8601 date-time with a time zone, e.g. 2026-03-10T12:05:00Z (got '{Clip(text)}').");
            return null;
        }

        if (value > now + AllowedClockSkew)
        {
            problems.Add($"'{path}.outcomeTimestamp' ({text}) lies in the future of this service's clock.");
            return null;
        }

        return value.ToUniversalTime();
    }

    private static Guid? Uuid(JsonElement owner, string path, string name, List<string> problems)
    {
        var text = RequiredString(owner, path, name, problems);
        if (text is null)
        {
            return null;
        }

        if (!Guid.TryParseExact(text, "D", out var id))
        {
            problems.Add($"'{path}.{name}' must be a UUID as this service issues them, e.g. 4e0a3a1e-3283-4575-ab82-028d55fe2719 (got '{Clip(text)}').");
            return null;
        }

        return id;
    }

    private static string? RequiredString(JsonElement owner, string path, string name, List<string> problems, int maxLength = 256)
    {
        if (!owner.TryGetProperty(name, out var element))
        {
            problems.Add($"'{path}.{name}' is required.");
            return null;
        }

        return StringValue(element, $"{path}.{name}", problems, maxLength);
    }

    private static string? OptionalString(JsonElement owner, string path, string name, List<string> problems, int maxLength)
        => owner.TryGetProperty(name, out var element) ? StringValue(element, $"{path}.{name}", problems, maxLength) : null;

    private static string? StringValue(JsonElement element, string name, List<string> problems, int maxLength)
    {
        if (element.ValueKind == JsonValueKind.Null)
        {
            problems.Add($"'{name}' must not be null (leave optional fields out instead).");
            return null;
        }

        if (element.ValueKind != JsonValueKind.String)
        {
            problems.Add($"'{name}' must be a string.");
            return null;
        }

        var text = element.GetString()!;
        if (string.IsNullOrWhiteSpace(text))
        {
            problems.Add($"'{name}' must not be empty.");
            return null;
        }

        if (text.Length > maxLength)
        {
            problems.Add($"'{name}' is longer than {maxLength} characters.");
            return null;
        }

        return text;
    }

    private static void Unknown(JsonElement owner, string prefix, List<string> problems, params string[] known)
    {
        foreach (var property in owner.EnumerateObject())
        {
            if (!known.Contains(property.Name, StringComparer.Ordinal))
            {
                problems.Add($"'{prefix}{Clip(property.Name)}' is not a CDS Hooks feedback field.");
            }
        }
    }

    private static string Clip(string text) => text.Length <= 64 ? text : text[..64] + "…";
}
