using System.Globalization;
using System.Text.Json;
using System.Text.Json.Nodes;
using System.Text.RegularExpressions;

namespace CdsNatremia.Cli.Replay;

/// <summary>
/// How each field of a scenario's <c>expect</c> is read from an answer. A field with a comparison here is compared as
/// written; any other field is compared by its value (<see cref="Generic"/>): strings and numbers must appear in the
/// cards' text, arrays and objects member by member, and a yes/no field without a comparison fails, so a new manifest
/// field is never passed over in silence.
/// </summary>
internal static partial class ManifestFields
{
    /// <summary>Prose for a person, not a checkable claim.</summary>
    public const string ClinicianExpects = "clinicianExpects";

    /// <summary>Whether a card (for the assessment hooks: the sodium assessment card) is expected.</summary>
    public const string Card = "card";

    /// <summary>The comparisons by field name.</summary>
    public static IReadOnlyDictionary<string, Func<FieldCheck, (string Seen, bool Pass)>> Known { get; } =
        new Dictionary<string, Func<FieldCheck, (string Seen, bool Pass)>>(StringComparer.Ordinal)
        {
            [Card] = CardPresent,
            ["indicator"] = Indicator,
            ["sodiumBand"] = Band,
            ["latestValidSodium"] = LatestValidSodium,
            ["mentions"] = c => Words(c, c.Expected.EnumerateArray().Select(e => e.ToString()).ToList()),
            ["tonicity"] = Tonicity,
            // Said of this patient: on the assessment card ("This patient is at high risk …") or on a rate card
            // ("**High risk of osmotic demyelination**, so the stricter limits apply"); never the generic caution.
            ["highRiskOsmoticDemyelination"] = c => Statement(c,
                c.Answer.All.Contains("patient is at high risk of osmotic demyelination", StringComparison.Ordinal)
                || c.Answer.All.Contains("High risk of osmotic demyelination**", StringComparison.Ordinal)),
            ["acute"] = c => Statement(c, c.Answer.AssessmentFindings.Count > 0
                ? c.Answer.AssessmentFinding(AcuteKind) is not null
                : c.Answer.All.Contains("**acute** hyponatremia", StringComparison.Ordinal)),
            ["glucoseCorrectedSodium"] = GlucoseCorrected,
            // The manifest gives the gap to the whole mOsm/kg; the card to a tenth.
            ["osmolalGap"] = c => NumberAt(c, OsmolalGap(), 0.5),
            ["riseMmolPerL"] = c => NumberAt(c, RiseAmount(), 0.05),
            ["riseHours"] = c => NumberAt(c, RiseHours(), 0.05),
            ["setAsideIds"] = SetAside,
            ["totalBodyWaterL"] = c => NumberAt(c, TotalBodyWater(), 0.05),
            ["predictedRisePerLitreMmolPerL"] = c => NumberAt(c, RisePerLitre(), 0.05),
            ["predictedRiseForOrderMmolPerL"] = c => NumberAt(c, RiseForOrder(), 0.05),
        };

    /// <summary>Compares a field no comparison names: by its value, as the type comment says.</summary>
    public static (string Seen, bool Pass) Generic(FieldCheck check)
    {
        ArgumentNullException.ThrowIfNull(check);
        var missing = new List<string>();
        if (!Appears(check.Answer, check.Expected, missing))
        {
            return ("no comparison is defined for this field (add one to ManifestFields)", false);
        }

        return missing.Count == 0 ? ("in the cards' text", true) : ("not in the cards: " + string.Join(", ", missing), false);
    }

    /// <summary>A manifest value as the table shows it: strings bare, lists and objects on one line, the rest as JSON.</summary>
    public static string Show(JsonElement value) => value.ValueKind switch
    {
        JsonValueKind.String => value.GetString() ?? string.Empty,
        JsonValueKind.Array => value.GetArrayLength() == 0 ? "(none)" : string.Join(", ", value.EnumerateArray().Select(Show)),
        JsonValueKind.Object => string.Join(", ", value.EnumerateObject().Select(p => $"{p.Name} {Show(p.Value)}")),
        _ => JsonSerializer.Serialize(value),
    };

    private static bool Appears(AnswerText answer, JsonElement value, List<string> missing)
    {
        switch (value.ValueKind)
        {
            case JsonValueKind.String:
                if (!answer.Mentions(value.GetString()!))
                {
                    missing.Add(value.GetString()!);
                }

                return true;
            case JsonValueKind.Number:
                if (!answer.MentionsNumber(value.GetDouble()))
                {
                    missing.Add(value.GetRawText());
                }

                return true;
            case JsonValueKind.Array:
                return value.EnumerateArray().Select(e => Appears(answer, e, missing)).ToList().TrueForAll(ok => ok);
            case JsonValueKind.Object:
                return value.EnumerateObject().Select(p => Appears(answer, p.Value, missing)).ToList().TrueForAll(ok => ok);
            default:
                return false;
        }
    }

    private static (string, bool) CardPresent(FieldCheck c)
    {
        var expected = c.Expected.ValueKind == JsonValueKind.True;
        if (c.IsOrderHook)
        {
            var count = c.Answer.Cards.Count;
            return (count == 0 ? "no card" : $"{count} card(s)", (count > 0) == expected);
        }

        var others = c.Answer.Cards.Count - (c.Answer.Assessment is null ? 0 : 1);
        var seen = (c.Answer.Assessment is null ? "no assessment card" : "assessment card") + (others > 0 ? $" (+{others} other)" : string.Empty);
        return (seen, (c.Answer.Assessment is not null) == expected);
    }

    private static (string, bool) Indicator(FieldCheck c)
    {
        var expected = c.Expected.GetString();
        if (c.IsOrderHook)
        {
            var indicators = c.Answer.Cards.Select(card => (string?)card["indicator"]).ToList();
            return (indicators.Count == 0 ? "no card" : string.Join(", ", indicators), indicators.Contains(expected));
        }

        var seen = (string?)c.Answer.Assessment?["indicator"];
        return (seen ?? "no assessment card", seen == expected);
    }

    /// <summary>Finding kinds the comparisons read (the service's phrase catalogue keys).</summary>
    private static readonly string[] HeadlineKinds = ["assessment.headline", "assessment.headline.not-hypotonic"];

    private const string AcuteKind = "onset.acute.finding";

    private static readonly string[] TonicityKinds = ["tonicity.measured.finding", "tonicity.calculated.finding", "tonicity.unknown.finding"];

    /// <summary>The latest usable sodium: the assessment card's headline value when it carries findings, else its text.</summary>
    private static (string, bool) LatestValidSodium(FieldCheck c)
    {
        if (!c.IsOrderHook && c.Answer.AssessmentFinding(HeadlineKinds) is { } headline && headline["values"]?["sodium"] is JsonValue value)
        {
            var seen = value.GetValue<double>();
            return (seen.ToString(CultureInfo.InvariantCulture), Math.Abs(seen - c.Expected.GetDouble()) <= 0.05);
        }

        return NumberAt(c, LatestSodium(), 0.05);
    }

    private static (string, bool) Band(FieldCheck c)
    {
        var expected = c.Expected.GetString() ?? string.Empty;
        if (!c.IsOrderHook && c.Answer.AssessmentFinding(HeadlineKinds) is { } headline && (string?)headline["values"]?["band"] is { } band)
        {
            return (band, band == expected);
        }

        if (!c.IsOrderHook)
        {
            var summary = (string?)c.Answer.Assessment?["summary"];
            if (summary is null)
            {
                return ("no assessment card", false);
            }

            var match = SummaryBand().Match(summary);
            return (match.Success ? match.Groups[1].Value : $"no band in \"{summary}\"", match.Success && match.Groups[1].Value == expected);
        }

        var found = Bands().Matches(c.Answer.All).Select(m => m.Value.ToLowerInvariant()).Distinct(StringComparer.Ordinal).ToList();
        return (found.Count == 0 ? "no band named" : string.Join(", ", found), found.Contains(expected));
    }

    private static (string, bool) Tonicity(FieldCheck c)
    {
        if (c.Answer.AssessmentFinding(TonicityKinds) is { } finding)
        {
            var kind = (string?)finding["values"]?["band"]?["kind"] ?? "tonicity.band.unknown";
            var seen = kind[(kind.LastIndexOf('.') + 1)..];
            return (seen, seen == c.Expected.GetString());
        }

        var match = SerumTonicity().Match(c.Answer.All);
        return match.Success ? (match.Groups[1].Value, match.Groups[1].Value == c.Expected.GetString()) : ("not stated", false);
    }

    private static (string, bool) Statement(FieldCheck c, bool stated)
    {
        var expected = c.Expected.ValueKind == JsonValueKind.True;
        return (stated ? "stated" : "not stated", stated == expected);
    }

    private static (string, bool) Words(FieldCheck c, IReadOnlyList<string> words)
    {
        var missing = words.Where(w => !c.Answer.Mentions(w)).ToList();
        if (words.Count == 0)
        {
            return ("(nothing to find)", true);
        }

        return (missing.Count == 0 ? $"all {words.Count} found" : "missing: " + string.Join(", ", missing), missing.Count == 0);
    }

    private static (string, bool) NumberAt(FieldCheck c, Regex pattern, double tolerance)
    {
        var seen = c.Answer.Number(pattern);
        return seen is { } value
            ? (value.ToString("0.###", CultureInfo.InvariantCulture), Math.Abs(value - c.Expected.GetDouble()) <= tolerance + 1e-9)
            : ("not stated", false);
    }

    private static (string, bool) GlucoseCorrected(FieldCheck c)
    {
        var lines = c.Answer.All.Split('\n');
        var parts = new List<string>();
        var pass = true;
        foreach (var method in c.Expected.EnumerateObject())
        {
            var value = method.Value.GetDouble();
            var text = value.ToString("0.###", CultureInfo.InvariantCulture);
            var found = lines.Any(l => l.Contains(method.Name, StringComparison.OrdinalIgnoreCase) && AnswerText.ContainsNumber(l, value));
            parts.Add(found ? $"{method.Name} {text}" : $"{method.Name}: not stated");
            pass &= found;
        }

        return (string.Join(", ", parts), pass);
    }

    private static (string, bool) SetAside(FieldCheck c)
    {
        var section = c.Answer.SetAsideSection();
        var ids = c.Expected.EnumerateArray().Select(e => e.GetString() ?? string.Empty).ToList();
        var missing = ids.Where(id => !Regex.IsMatch(section, "/" + Regex.Escape(id) + @"(?![\w.-])", RegexOptions.None, TimeSpan.FromSeconds(1))).ToList();
        return (missing.Count == 0 ? $"all {ids.Count} set aside" : "not set aside: " + string.Join(", ", missing), missing.Count == 0);
    }

    [GeneratedRegex(@"\((profound|moderate|mild|normal)\b")]
    private static partial Regex SummaryBand();

    [GeneratedRegex(@"\b(profound|moderate|mild)\b", RegexOptions.IgnoreCase)]
    private static partial Regex Bands();

    [GeneratedRegex(@"(?:Latest usable sodium|Serum sodium used: Sodium|sodium is already|ordered at sodium) (-?\d+(?:\.\d+)?) mmol/L")]
    private static partial Regex LatestSodium();

    [GeneratedRegex(@"Serum tonicity: \*\*(\w+)\*\*")]
    private static partial Regex SerumTonicity();

    [GeneratedRegex(@"Osmolal gap\**\s+(-?\d+(?:\.\d+)?) mOsm/kg")]
    private static partial Regex OsmolalGap();

    [GeneratedRegex(@"Rise since the nadir: (-?\d+(?:\.\d+)?) mmol/L in")]
    private static partial Regex RiseAmount();

    [GeneratedRegex(@"Rise since the nadir: -?\d+(?:\.\d+)? mmol/L in (\d+(?:\.\d+)?) h")]
    private static partial Regex RiseHours();

    [GeneratedRegex(@"\*\*Total body water\*\*[^\n]*?= \*\*(\d+(?:\.\d+)?) L\*\*")]
    private static partial Regex TotalBodyWater();

    [GeneratedRegex(@"\*\*Per litre\*\*[^\n]*?= \*\*\+?(-?\d+(?:\.\d+)?) mmol/L\*\*")]
    private static partial Regex RisePerLitre();

    [GeneratedRegex(@"Predicted change from this order: \*\*\+?(-?\d+(?:\.\d+)?) mmol/L\*\*")]
    private static partial Regex RiseForOrder();
}
