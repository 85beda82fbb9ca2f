using System.Collections.Frozen;
using System.Text.RegularExpressions;
using CdsNatremia.Core.Facts;

namespace CdsNatremia.Core.Knowledge;

/// <summary>
/// A list of codes the rules match against, loaded from one FHIR ValueSet in <c>profiles/</c>.
/// Exact codes match by system and code; class prefixes (ATC and ICD-10 "is-a" filters, where no terminology
/// server is at hand) match any code that starts with them; names match whole words in free text, case-insensitively.
/// Immutable and thread-safe.
/// </summary>
public sealed class CodeSet
{
    private readonly CodeRef[] _codeList;
    private readonly CodeRef[] _prefixList;
    private readonly FrozenDictionary<string, FrozenSet<string>> _codes;
    private readonly FrozenDictionary<string, string[]> _prefixes;
    private readonly Regex? _names;

    /// <summary>Creates a code set.</summary>
    /// <param name="id">The ValueSet id, e.g. "drug-thiazide".</param>
    /// <param name="url">The ValueSet canonical URL.</param>
    /// <param name="version">The ValueSet version.</param>
    /// <param name="label">The short label a card prints, e.g. "thiazide or thiazide-like diuretic".</param>
    /// <param name="codes">Exact codes by system.</param>
    /// <param name="prefixes">Class prefixes by system.</param>
    /// <param name="names">Generic names for whole-word text matching.</param>
    /// <param name="tier">Evidence tier for drug groups; null for other sets.</param>
    public CodeSet(
        string id,
        string url,
        string version,
        string label,
        IEnumerable<CodeRef> codes,
        IEnumerable<CodeRef> prefixes,
        IEnumerable<string> names,
        EvidenceTier? tier = null)
    {
        Id = Guard.NotNull(id, nameof(id));
        Url = Guard.NotNull(url, nameof(url));
        Version = Guard.NotNull(version, nameof(version));
        Label = Guard.NotNull(label, nameof(label));
        Tier = tier;
        // Lists in the order loaded (for listing and checks); frozen look-ups for matching on every request.
        var byCodeSystem = Guard.NotNull(codes, nameof(codes))
            .GroupBy(c => c.System, StringComparer.Ordinal)
            .Select(g => (System: g.Key, Codes: g.Select(c => Normalize(g.Key, c.Code)).Distinct(StringComparer.OrdinalIgnoreCase).ToArray()))
            .ToArray();
        _codeList = byCodeSystem.SelectMany(g => g.Codes.Select(c => new CodeRef(g.System, c))).ToArray();
        _codes = byCodeSystem.ToFrozenDictionary(g => g.System, g => g.Codes.ToFrozenSet(StringComparer.OrdinalIgnoreCase), StringComparer.Ordinal);
        var byPrefixSystem = Guard.NotNull(prefixes, nameof(prefixes))
            .GroupBy(c => c.System, StringComparer.Ordinal)
            .Select(g => (System: g.Key, Prefixes: g.Select(c => Normalize(g.Key, c.Code)).Distinct(StringComparer.OrdinalIgnoreCase).ToArray()))
            .ToArray();
        _prefixList = byPrefixSystem.SelectMany(g => g.Prefixes.Select(c => new CodeRef(g.System, c))).ToArray();
        _prefixes = byPrefixSystem.ToFrozenDictionary(g => g.System, g => g.Prefixes, StringComparer.Ordinal);
        Names = Guard.NotNull(names, nameof(names))
            .Select(n => n.Trim().ToLowerInvariant())
            .Where(n => n.Length >= 3)
            .Distinct(StringComparer.Ordinal)
            .OrderByDescending(n => n.Length)
            .ToArray();
        if (Names.Count > 0)
        {
            // Whole words only: no letter or digit may touch the name on either side, so "indapamide" never matches "xindapamidex".
            // Compiled: the set is built once at start-up and matched against every medicine of every request.
            // No match timeout: the pattern is an alternation of escaped literals (words joined by \s+) between
            // one-character lookarounds, so matching is linear in the text and cannot backtrack catastrophically. A
            // timeout here would make a busy server silently miss a drug name (a timed-out match reads as "no match").
            var alternatives = string.Join("|", Names.Select(n => Regex.Escape(n).Replace("\\ ", "\\s+", StringComparison.Ordinal)));
            _names = new Regex(
                $"(?<![\\p{{L}}\\p{{N}}])(?:{alternatives})(?![\\p{{L}}\\p{{N}}])",
                RegexOptions.IgnoreCase | RegexOptions.CultureInvariant | RegexOptions.Compiled,
                Regex.InfiniteMatchTimeout);

            // Run it once now, at load time, so the compiled matcher's first-use cost is paid at start-up, not in a request.
            WarmUp(_names, Names[0]);
        }
    }

    /// <summary>The ValueSet id.</summary>
    public string Id { get; }

    /// <summary>The ValueSet canonical URL.</summary>
    public string Url { get; }

    /// <summary>The ValueSet version.</summary>
    public string Version { get; }

    /// <summary>The label cards print.</summary>
    public string Label { get; }

    /// <summary>The evidence tier (drug groups only).</summary>
    public EvidenceTier? Tier { get; }

    /// <summary>Generic names, lower case, longest first.</summary>
    public IReadOnlyList<string> Names { get; }

    /// <summary>Every exact code, for checks against source tables.</summary>
    public IEnumerable<CodeRef> Codes => _codeList;

    /// <summary>Every class prefix.</summary>
    public IEnumerable<CodeRef> Prefixes => _prefixList;

    /// <summary>True when any of <paramref name="codes"/> is in the set (no delegate per call, unlike <c>codes.Any(set.Matches)</c>).</summary>
    public bool MatchesAny(IReadOnlyList<CodeRef> codes)
    {
        Guard.NotNull(codes, nameof(codes));
        for (var i = 0; i < codes.Count; i++)
        {
            if (Matches(codes[i]))
            {
                return true;
            }
        }

        return false;
    }

    /// <summary>True when the code is in the set, exactly or under one of its class prefixes.</summary>
    public bool Matches(CodeRef code)
    {
        if (string.IsNullOrWhiteSpace(code.System) || string.IsNullOrWhiteSpace(code.Code))
        {
            return false;
        }

        var value = Normalize(code.System, code.Code);
        if (_codes.TryGetValue(code.System, out var exact) && exact.Contains(value))
        {
            return true;
        }

        if (_prefixes.TryGetValue(code.System, out var prefixes))
        {
            foreach (var prefix in prefixes)
            {
                if (value.StartsWith(prefix, StringComparison.OrdinalIgnoreCase))
                {
                    return true;
                }
            }
        }

        return false;
    }

    private static void WarmUp(Regex names, string sample) => _ = names.IsMatch(sample);

    /// <summary>ICD-10 codes are compared without their dot ("K74.6" and "K746" are the same code); others as sent, trimmed.</summary>
    private static string Normalize(string system, string code)
        => system is CodeSystems.Icd10 or CodeSystems.Icd10Cm
            ? code.Trim().Replace(".", string.Empty, StringComparison.Ordinal).ToUpperInvariant()
            : code.Trim();

    /// <summary>The first name found as a whole word in <paramref name="text"/>, or null.</summary>
    public string? MatchName(string? text)
    {
        if (_names is null || string.IsNullOrWhiteSpace(text))
        {
            return null;
        }

        var match = _names.Match(text);
        return match.Success ? match.Value.ToLowerInvariant() : null;
    }
}
