using System.Text.Json;

namespace CdsNatremia.Scenarios;

/// <summary>One invented patient: its Bundle, the hook it is meant for, and what a clinician would expect to see.</summary>
public sealed record Scenario
{
    /// <summary>Scenario id, e.g. "01-thiazide-three-weeks".</summary>
    public required string Id { get; init; }

    /// <summary>Short title.</summary>
    public required string Title { get; init; }

    /// <summary>The invented clinical story.</summary>
    public required string Story { get; init; }

    /// <summary>The patient's id in the Bundle.</summary>
    public required string PatientId { get; init; }

    /// <summary>"patient-view", "result", "order-select" or "order-sign".</summary>
    public required string Hook { get; init; }

    /// <summary>The patient's data (a collection Bundle), as JSON text.</summary>
    public required string BundleJson { get; init; }

    /// <summary>Draft orders for the order hooks (a Bundle), as JSON text.</summary>
    public string? DraftOrdersJson { get; init; }

    /// <summary>For order-select: the selected draft orders.</summary>
    public IReadOnlyList<string> Selections { get; init; } = [];

    /// <summary>For the result hook: ids of the newly arrived Observations.</summary>
    public IReadOnlyList<string> NewResultIds { get; init; } = [];

    /// <summary>
    /// Resources an EHR wrongly sends inside a prefetch key although a FHIR search would not return them (e.g. another
    /// patient's result), by key: replay adds them to that key as the faulty EHR would. Empty for most scenarios.
    /// </summary>
    public IReadOnlyDictionary<string, IReadOnlyList<string>> Misdirected { get; init; } = new Dictionary<string, IReadOnlyList<string>>();

    /// <summary>The expectation, as the manifest states it.</summary>
    public required JsonElement Expect { get; init; }

    /// <summary>True when a card is expected.</summary>
    public bool ExpectsCard => Expect.TryGetProperty("card", out var c) && c.ValueKind == JsonValueKind.True;

    /// <summary>The expected indicator of the assessment card, when one is expected.</summary>
    public string? ExpectedIndicator => Expect.TryGetProperty("indicator", out var i) && i.ValueKind == JsonValueKind.String ? i.GetString() : null;

    /// <summary>The expected band.</summary>
    public string? ExpectedBand => Expect.TryGetProperty("sodiumBand", out var b) && b.ValueKind == JsonValueKind.String ? b.GetString() : null;

    /// <summary>Words the cards should contain (case-insensitive).</summary>
    public IReadOnlyList<string> ExpectedMentions => Expect.TryGetProperty("mentions", out var m) && m.ValueKind == JsonValueKind.Array
        ? m.EnumerateArray().Where(e => e.ValueKind == JsonValueKind.String).Select(e => e.GetString()!).ToList()
        : [];

    /// <summary>What a clinician would expect to see, in words.</summary>
    public string? ClinicianExpects => Expect.TryGetProperty("clinicianExpects", out var c) && c.ValueKind == JsonValueKind.String ? c.GetString() : null;
}
