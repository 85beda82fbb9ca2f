using System.Text.Json.Nodes;

namespace CdsNatremia.Service.Course;

/// <summary>
/// The CDS Hooks link of type "smart" that opens the sodium-course view from a card (CDS Hooks 2.0, Link): the EHR
/// launches the configured launch URL with its own iss and launch. appContext names the card (its uuid and topic) and
/// nothing about the patient.
/// </summary>
public static class CourseLink
{
    /// <summary>The link's label.</summary>
    public const string Label = "Open the sodium course";

    /// <summary>Card topics that carry the link: the assessment, the correction rate and the drug cards.</summary>
    public static IReadOnlySet<string> Topics { get; } = new HashSet<string>(StringComparer.Ordinal)
    {
        "sodium-assessment", "correction-rate", "drug-cause", "drug-order-warning",
    };

    /// <summary>The link for a card, or null when its topic does not carry one.</summary>
    public static JsonObject? For(string topic, Guid cardUuid, string launchUrl)
    {
        ArgumentNullException.ThrowIfNull(topic);
        if (!Topics.Contains(topic))
        {
            return null;
        }

        return new JsonObject
        {
            ["label"] = Label,
            ["url"] = launchUrl,
            ["type"] = "smart",
            ["appContext"] = new JsonObject { ["card"] = cardUuid.ToString(), ["topic"] = topic }.ToJsonString(),
        };
    }
}
