using CdsNatremia.Core.Engine;

namespace CdsNatremia.Service.Hooks;

/// <summary>One CDS service as discovery lists it, with what the host needs to run it.</summary>
public sealed record ServiceDefinition
{
    /// <summary>The service id (URL segment).</summary>
    public required string Id { get; init; }

    /// <summary>The hook name as the EHR sends it.</summary>
    public required string Hook { get; init; }

    /// <summary>The hook kind the engine understands.</summary>
    public required HookKind Kind { get; init; }

    /// <summary>Title for discovery.</summary>
    public required string Title { get; init; }

    /// <summary>Description for discovery.</summary>
    public required string Description { get; init; }

    /// <summary>The hook's context fields.</summary>
    public required IReadOnlyList<ContextField> Context { get; init; }

    /// <summary>Prefetch keys this service declares (templates from <see cref="PrefetchKeys"/>).</summary>
    public required IReadOnlyList<string> PrefetchKeys { get; init; }

    /// <summary>Keys without which the service cannot advise: missing and not obtainable → HTTP 412.</summary>
    public required IReadOnlyList<string> RequiredKeys { get; init; }

    /// <summary>Optional usage text for discovery.</summary>
    public string? UsageRequirements { get; init; }
}
