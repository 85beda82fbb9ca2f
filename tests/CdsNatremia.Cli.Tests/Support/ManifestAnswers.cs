using System.Globalization;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using CdsNatremia.Scenarios;

namespace CdsNatremia.Cli.Tests.Support;

/// <summary>
/// A fake service's answers written from the manifest: every field stated as expected, or one field deliberately wrong
/// (numbers off by 5, words swapped, statements left out or added, a card missing or extra).
/// </summary>
internal static class ManifestAnswers
{
    public static JsonObject Answer(Scenario scenario, string? wrongField = null)
    {
        var expect = scenario.Expect;
        var wrong = (string name) => name == wrongField;
        var expectsCard = scenario.ExpectsCard ^ wrong("card");
        if (!expectsCard)
        {
            return new JsonObject { ["cards"] = new JsonArray() };
        }

        var isOrder = scenario.Hook is not ("patient-view" or "result");
        var detail = new StringBuilder();
        var band = Text(expect, "sodiumBand", wrong, "mild", "moderate") ?? "moderate";
        var sodium = Number(expect, "latestValidSodium", wrong) ?? 128;
        detail.AppendLine(isOrder ? $"The sodium is already {F(sodium)} mmol/L ({band})." : $"- Latest usable sodium {F(sodium)} mmol/L: **{band} hyponatremia**.");
        foreach (var field in expect.EnumerateObject())
        {
            var value = field.Value;
            switch (field.Name)
            {
                case "card" or "sodiumBand" or "latestValidSodium" or "indicator" or "clinicianExpects":
                    break;
                case "mentions":
                    detail.AppendLine("- Mentions: " + string.Join("; ", value.EnumerateArray().Select(w => w.GetString()!)) + ".");
                    break;
                case "tonicity":
                    detail.AppendLine(CultureInfo.InvariantCulture, $"- Serum tonicity: **{Text(expect, field.Name, wrong, "isotonic", "hypotonic")}** (measured).");
                    break;
                case "highRiskOsmoticDemyelination" when value.GetBoolean() ^ wrong(field.Name):
                    detail.AppendLine("- **High risk of osmotic demyelination**, so the stricter limits apply.");
                    break;
                case "acute" when value.GetBoolean() ^ wrong(field.Name):
                    detail.AppendLine("4. **Onset**: a fall documented within 48 h, so **acute** hyponatremia.");
                    break;
                case "glucoseCorrectedSodium":
                    detail.AppendLine("- By method: " + string.Join(", ", value.EnumerateObject().Select(m => $"{m.Name} {F(m.Value.GetDouble() + (wrong(field.Name) ? 5 : 0))} mmol/L")) + ".");
                    break;
                case "osmolalGap":
                    detail.AppendLine(CultureInfo.InvariantCulture, $"3. **Osmolal gap** {F(Number(expect, field.Name, wrong)!.Value)} mOsm/kg.");
                    break;
                case "riseMmolPerL" or "riseHours":
                    break;
                case "totalBodyWaterL":
                    detail.AppendLine(CultureInfo.InvariantCulture, $"1. **Total body water** = weight × fraction = **{F(Number(expect, field.Name, wrong)!.Value)} L**.");
                    break;
                case "predictedRisePerLitreMmolPerL":
                    detail.AppendLine(CultureInfo.InvariantCulture, $"2. **Per litre** = (513 − Na) / (TBW + 1) = **+{F(Number(expect, field.Name, wrong)!.Value)} mmol/L**.");
                    break;
                case "predictedRiseForOrderMmolPerL":
                    detail.AppendLine(CultureInfo.InvariantCulture, $"- Predicted change from this order: **+{F(Number(expect, field.Name, wrong)!.Value)} mmol/L**.");
                    break;
                case "setAsideIds":
                    break;
                default:
                    // A field the tool compares by its value: state the value unless it is the one to get wrong.
                    if (!wrong(field.Name))
                    {
                        detail.AppendLine(CultureInfo.InvariantCulture, $"- {field.Name}: {ManifestValue(value)}.");
                    }

                    break;
            }
        }

        if (expect.TryGetProperty("riseMmolPerL", out _) || expect.TryGetProperty("riseHours", out _))
        {
            detail.AppendLine(CultureInfo.InvariantCulture, $"- Rise since the nadir: {F(Number(expect, "riseMmolPerL", wrong) ?? 0)} mmol/L in {F(Number(expect, "riseHours", wrong) ?? 0)} h.");
        }

        detail.AppendLine().AppendLine("**Data set aside (not used, with the reason)**").AppendLine();
        if (expect.TryGetProperty("setAsideIds", out var setAside) && !wrong("setAsideIds"))
        {
            foreach (var id in setAside.EnumerateArray())
            {
                detail.AppendLine(CultureInfo.InvariantCulture, $"- Observation/{id.GetString()} (Sodium): not used");
            }
        }

        detail.AppendLine().AppendLine("**Cautions**").AppendLine().Append("- Advisory only.");
        var text = detail.ToString();
        if (wrong("mentions") && expect.GetProperty("mentions").EnumerateArray().FirstOrDefault() is { ValueKind: JsonValueKind.String } first)
        {
            // The first word the manifest asks for appears nowhere in the answer.
            text = text.Replace(first.GetString()!, "…", StringComparison.OrdinalIgnoreCase);
        }

        var indicator = Text(expect, "indicator", wrong, "info", "critical") ?? "info";
        var card = new JsonObject
        {
            ["uuid"] = Guid.NewGuid().ToString(),
            ["summary"] = isOrder ? "Order warning" : $"Sodium {F(sodium)} mmol/L ({band} hyponatremia)",
            ["indicator"] = indicator,
            ["detail"] = text,
            ["source"] = new JsonObject
            {
                ["label"] = "fake",
                ["topic"] = new JsonObject { ["system"] = "urn:fake", ["code"] = isOrder ? "drug-order-warning" : "sodium-assessment" },
            },
        };
        return new JsonObject { ["cards"] = new JsonArray(card) };
    }

    private static string? Text(JsonElement expect, string name, Func<string, bool> wrong, string instead, string otherwise)
    {
        if (!expect.TryGetProperty(name, out var value))
        {
            return null;
        }

        var text = value.GetString()!;
        return !wrong(name) ? text : text == instead ? otherwise : instead;
    }

    private static double? Number(JsonElement expect, string name, Func<string, bool> wrong)
        => expect.TryGetProperty(name, out var value) ? value.GetDouble() + (wrong(name) ? 5 : 0) : null;

    private static string ManifestValue(JsonElement value) => value.ValueKind switch
    {
        JsonValueKind.Array => string.Join(", ", value.EnumerateArray().Select(ManifestValue)),
        JsonValueKind.Object => string.Join(", ", value.EnumerateObject().Select(p => $"{p.Name} {ManifestValue(p.Value)}")),
        JsonValueKind.String => value.GetString()!,
        _ => value.GetRawText(),
    };

    private static string F(double value) => value.ToString("0.###", CultureInfo.InvariantCulture);
}
