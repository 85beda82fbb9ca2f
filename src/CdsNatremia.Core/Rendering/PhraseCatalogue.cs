using System.Collections.Frozen;
using System.Resources;
using System.Text;
using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Text;
using CdsNatremia.Core.Workup;

namespace CdsNatremia.Core.Rendering;

/// <summary>
/// The one place every user-facing sentence lives: the resource files in <c>src/CdsNatremia.Core/Phrases/</c>
/// (<c>Cards.resx</c> for the card and report frame, <c>Workup.resx</c>, <c>CorrectionRate.resx</c>, <c>Drugs.resx</c>
/// for the rules' findings). A phrase is keyed by a finding kind and refers to the finding's slots as <c>{name}</c>.
/// Loaded once into a frozen dictionary; a missing key or slot is a programming error and throws, so tests find it.
/// Thread-safe.
/// </summary>
public sealed class PhraseCatalogue
{
    private const string ResourcePrefix = "CdsNatremia.Core.Phrases.";
    private readonly FrozenDictionary<string, string> _phrases;

    private PhraseCatalogue(FrozenDictionary<string, string> phrases) => _phrases = phrases;

    /// <summary>The catalogue built into the core.</summary>
    public static PhraseCatalogue Default { get; } = Load();

    /// <summary>Every key, for the completeness test.</summary>
    public IEnumerable<string> Keys => _phrases.Keys;

    /// <summary>The raw phrase for <paramref name="key"/> (with its {slot} markers).</summary>
    public string this[string key] => _phrases.TryGetValue(key, out var phrase)
        ? phrase
        : throw new KeyNotFoundException($"The phrase catalogue has no phrase '{key}'.");

    /// <summary>True when the catalogue holds <paramref name="key"/>.</summary>
    public bool Contains(string key) => _phrases.ContainsKey(key);

    /// <summary>Words <paramref name="finding"/> with the display's times.</summary>
    public string Render(Finding finding, TimeDisplay display)
    {
        var text = TextBuffers.Take(256);
        RenderInto(text, finding, display);
        return TextBuffers.Return(text);
    }

    /// <summary>Words <paramref name="finding"/> at the end of <paramref name="text"/> (nested phrases and lists too: no string in between).</summary>
    public void RenderInto(StringBuilder text, Finding finding, TimeDisplay display)
    {
        Guard.NotNull(text, nameof(text));
        Guard.NotNull(finding, nameof(finding));
        Guard.NotNull(display, nameof(display));
        var phrase = this[finding.Kind];
        var i = 0;
        while (i < phrase.Length)
        {
            var open = phrase.IndexOf('{', i);
            if (open < 0)
            {
                text.Append(phrase, i, phrase.Length - i);
                break;
            }

            var close = phrase.IndexOf('}', open + 1);
            if (close < 0)
            {
                throw new FormatException($"Phrase '{finding.Kind}' has an unclosed slot.");
            }

            text.Append(phrase, i, open - i);
            var name = phrase.AsSpan(open + 1, close - open - 1);
            var value = finding.Find(name) ?? throw new InvalidOperationException($"Phrase '{finding.Kind}' needs slot '{name}', which the finding does not carry.");
            AppendValue(text, value, display);
            i = close + 1;
        }
    }

    /// <summary>Words a phrase that takes no slots (headings, standing lines).</summary>
    public string Text(string key) => this[key];

    private void AppendValue(StringBuilder text, SlotValue value, TimeDisplay display)
    {
        switch (value)
        {
            case PhraseValue p:
                RenderInto(text, p.Finding, display);
                break;
            case ListValue l:
                for (var i = 0; i < l.Values.Count; i++)
                {
                    if (i > 0)
                    {
                        text.Append(l.Separator);
                    }

                    AppendValue(text, l.Values[i], display);
                }

                break;
            default:
                text.Append(RenderValue(value, display));
                break;
        }
    }

    private static string RenderValue(SlotValue value, TimeDisplay display) => value switch
    {
        NumberValue { Decimals: null } n => ClinicalNumber.Format(n.Value),
        NumberValue n => ClinicalNumber.Rounded(n.Value, n.Decimals.Value),
        TextValue { Escape: true } t => Markdown.Escape(t.Value),
        TextValue t => t.Value,
        TimeValue t => t.Style switch
        {
            TimeStyle.Short => display.ShortTime(t.Value),
            TimeStyle.Age => display.Age(t.Value),
            TimeStyle.AgeAndTime => display.AgeAndTime(t.Value),
            TimeStyle.Day => display.Day(t.Value),
            _ => display.Time(t.Value),
        },
        DurationValue d => WorkupData.Duration(d.Hours),
        ResultValue r => Cite.Result(r.Result, display),
        _ => throw new InvalidOperationException($"No rendering for {value.GetType().Name}."),
    };

    private static PhraseCatalogue Load()
    {
        var assembly = typeof(PhraseCatalogue).Assembly;
        var phrases = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var name in assembly.GetManifestResourceNames().Where(n => n.StartsWith(ResourcePrefix, StringComparison.Ordinal)).Order(StringComparer.Ordinal))
        {
            using var stream = assembly.GetManifestResourceStream(name)!;
            using var reader = new ResourceReader(stream);
            var entries = reader.GetEnumerator();
            while (entries.MoveNext())
            {
                var key = (string)entries.Key;
                if (!phrases.TryAdd(key, (string)entries.Value!))
                {
                    throw new InvalidOperationException($"Phrase '{key}' is defined twice in the catalogue ({name}).");
                }
            }
        }

        return new PhraseCatalogue(phrases.ToFrozenDictionary(StringComparer.Ordinal));
    }
}
