using System.Globalization;
using System.Text.RegularExpressions;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Knowledge;

namespace CdsNatremia.Core.CorrectionRate;

/// <summary>
/// Recognises a draft order for intravenous sodium chloride 0.9%, 3% or 0.45%, or Ringer's lactate: by the codes and
/// names of the <c>fluid-sodium-chloride</c> ValueSet, and by the ingredient strength ("30 mg/mL", "3 g/100 mL") or a
/// percentage next to sodium chloride or saline in the text ("3%"). Oral routes are never infusions. The concentration
/// decides the prediction, so a fluid whose concentration cannot be read is reported as such, never guessed.
/// </summary>
public static partial class InfusateRecognizer
{
    private const int MaxTextLength = 500;

    /// <summary>The ValueSet id of the fluids.</summary>
    public const string FluidSetId = "fluid-sodium-chloride";

    /// <summary>RxNorm 313002, sodium chloride 9 mg/mL injectable solution (ValueSet fluid-sodium-chloride: verified).</summary>
    public const string RxNormSaline09 = "313002";

    /// <summary>The recognition, or null when the order is not an intravenous sodium-containing fluid.</summary>
    public static InfusateRecognition? Recognize(MedicationFact order, CodeSet? fluids, InfusionOptions options)
    {
        Guard.NotNull(order, nameof(order));
        Guard.NotNull(options, nameof(options));
        if (IsOral(order.Route))
        {
            return null;
        }

        var texts = order.Ingredients.Select(i => i.Text).Append(order.Text).Append(order.DosageText).OfType<string>().Select(Clip).ToList();
        var setMatch = fluids is null ? null : MedicationMatching.Match(fluids, order);
        var ringers = texts.Any(t => RingersName().IsMatch(t));
        var saline = texts.Any(t => SalineName().IsMatch(t))
            || order.Ingredients.Any(i => i.Codes.Any(c => fluids?.Matches(c) == true));
        if (setMatch is null && !ringers && !saline)
        {
            return null;
        }

        var routeStated = !string.IsNullOrWhiteSpace(order.Route);
        if (ringers)
        {
            return new(Infusate.Of(InfusateKind.RingersLactate, options), ByName, routeStated);
        }

        if (order.ProductCodes.Concat(order.Ingredients.SelectMany(i => i.Codes))
            .Any(c => c.System == CodeSystems.RxNorm && c.Code == RxNormSaline09))
        {
            return new(Infusate.Of(InfusateKind.Saline09, options), Finding.Of(FindingKind.RateHowRxnorm, Slot.Text("code", RxNormSaline09)), routeStated);
        }

        foreach (var ingredient in order.Ingredients)
        {
            if (Percent(FromStrength(ingredient.StrengthText)) is { } kind)
            {
                return new(Infusate.Of(kind, options), Finding.Of(FindingKind.RateHowStrength, Slot.Text("strength", ingredient.StrengthText ?? string.Empty)), routeStated);
            }
        }

        foreach (var text in texts)
        {
            if (Percent(FromText(text)) is { } kind)
            {
                return new(Infusate.Of(kind, options), Finding.Of(FindingKind.RateHowConcentration), routeStated);
            }

            if (HalfNormal().IsMatch(text))
            {
                return new(Infusate.Of(InfusateKind.Saline045, options), ByName, routeStated);
            }

            if (NormalSaline().IsMatch(text))
            {
                return new(Infusate.Of(InfusateKind.Saline09, options), ByName, routeStated);
            }
        }

        return new(null, setMatch is null ? ByName : Finding.Of(FindingKind.RateHowMatched, Slot.Text("by", setMatch.By)), routeStated);
    }

    /// <summary>Recognised by a name in the order text.</summary>
    private static Finding ByName => Finding.Of(FindingKind.RateHowName);

    /// <summary>Grams of sodium chloride per 100 mL (per cent w/v) from a strength such as "30 mg/1 mL" or "3 g/100 mL".</summary>
    public static double? FromStrength(string? strength)
    {
        if (string.IsNullOrWhiteSpace(strength))
        {
            return null;
        }

        var m = StrengthPattern().Match(Clip(strength));
        if (!m.Success)
        {
            return null;
        }

        var amount = double.Parse(m.Groups["n"].Value, CultureInfo.InvariantCulture);
        var grams = m.Groups["nu"].Value.ToLowerInvariant() switch
        {
            "g" => amount,
            "mg" => amount / 1000,
            _ => double.NaN,
        };
        var volume = m.Groups["d"].Success && m.Groups["d"].Value.Length > 0 ? double.Parse(m.Groups["d"].Value, CultureInfo.InvariantCulture) : 1;
        var millilitres = m.Groups["du"].Value.ToLowerInvariant() switch
        {
            "ml" => volume,
            "dl" => volume * 100,
            "l" => volume * 1000,
            _ => double.NaN,
        };
        var percent = grams / millilitres * 100;
        return double.IsFinite(percent) && percent > 0 ? percent : null;
    }

    /// <summary>The per-cent concentration written next to sodium chloride or saline (or as mg/mL), or null.</summary>
    public static double? FromText(string? text)
    {
        if (string.IsNullOrWhiteSpace(text))
        {
            return null;
        }

        foreach (Match m in PercentPattern().Matches(Clip(text)))
        {
            var value = double.Parse(m.Groups["p"].Value, CultureInfo.InvariantCulture);
            if (Percent(value) is not null)
            {
                return value;
            }
        }

        return FromStrength(text);
    }

    private static InfusateKind? Percent(double? percent) => percent switch
    {
        null => null,
        var p when Math.Abs(p.Value - 0.9) < 0.005 => InfusateKind.Saline09,
        var p when Math.Abs(p.Value - 3) < 0.005 => InfusateKind.Saline3,
        var p when Math.Abs(p.Value - 0.45) < 0.005 => InfusateKind.Saline045,
        _ => null,
    };

    private static bool IsOral(string? route)
        => route is not null && OralRoute().IsMatch(Clip(route));

    // The patterns have no nested quantifiers, so no match timeout is set (a timeout could fail a request on a busy
    // machine); client text is cut to a length no real order text reaches, which bounds the work.
    private static string Clip(string text) => text.Length <= MaxTextLength ? text : text[..MaxTextLength];

    [GeneratedRegex(@"(?<![\p{L}\p{N}])(oral|by mouth|per os|PO|enteral|nasogastric)(?![\p{L}\p{N}])", RegexOptions.IgnoreCase | RegexOptions.CultureInvariant)]
    private static partial Regex OralRoute();

    [GeneratedRegex(@"(?<![\p{L}\p{N}])(sodium\s+chloride|saline|NaCl)(?![\p{L}\p{N}])", RegexOptions.IgnoreCase | RegexOptions.CultureInvariant)]
    private static partial Regex SalineName();

    [GeneratedRegex(@"(?<![\p{L}\p{N}])(ringer'?s?\s+lactate|lactated\s+ringer'?s?|hartmann'?s?(\s+solution)?|compound\s+sodium\s+lactate)(?![\p{L}\p{N}])", RegexOptions.IgnoreCase | RegexOptions.CultureInvariant)]
    private static partial Regex RingersName();

    [GeneratedRegex(@"(?<![\p{L}\p{N}])half[\s-]+normal\s+saline(?![\p{L}\p{N}])", RegexOptions.IgnoreCase | RegexOptions.CultureInvariant)]
    private static partial Regex HalfNormal();

    [GeneratedRegex(@"(?<![\p{L}\p{N}-])normal\s+saline(?![\p{L}\p{N}])", RegexOptions.IgnoreCase | RegexOptions.CultureInvariant)]
    private static partial Regex NormalSaline();

    [GeneratedRegex(@"(?<![\p{N}.])(?<p>\d+(?:\.\d+)?)\s*%", RegexOptions.CultureInvariant)]
    private static partial Regex PercentPattern();

    [GeneratedRegex(@"(?<![\p{N}.])(?<n>\d+(?:\.\d+)?)\s*(?<nu>mg|g)\s*/\s*(?<d>\d+(?:\.\d+)?)?\s*(?<du>mL|dL|L)(?![\p{L}])", RegexOptions.IgnoreCase | RegexOptions.CultureInvariant)]
    private static partial Regex StrengthPattern();
}
