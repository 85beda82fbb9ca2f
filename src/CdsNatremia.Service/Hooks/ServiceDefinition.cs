using CdsNatremia.Core.Engine;

namespace CdsNatremia.Service.Hooks;

/// <summary>
/// One CDS service as this host offers it: the hook's definition (<see cref="HookDefinitions"/>) with the hook name as configured
/// (the result hook's domain). Everything else reads through to <see cref="Definition"/>.
/// </summary>
public sealed record ServiceDefinition
{
    /// <summary>The hook's one definition.</summary>
    public required HookDefinition Definition { get; init; }

    /// <summary>The hook name as the EHR sends it (for an organisation-specific hook, with the configured domain).</summary>
    public required string Hook { get; init; }

    /// <summary>The service id (URL segment).</summary>
    public string Id => Definition.ServiceId;

    /// <summary>The hook kind the engine understands.</summary>
    public HookKind Kind => Definition.Kind;

    /// <summary>Title for discovery.</summary>
    public string Title => Definition.Title;

    /// <summary>Description for discovery.</summary>
    public string Description => Definition.Description;

    /// <summary>The hook's context fields.</summary>
    public IReadOnlyList<ContextField> Context => Definition.Context;

    /// <summary>Prefetch keys this service declares (templates from <see cref="Core.Engine.PrefetchKeys"/>).</summary>
    public IReadOnlyList<string> PrefetchKeys => Definition.Prefetch;

    /// <summary>Keys without which the service cannot advise: missing and not obtainable → HTTP 412.</summary>
    public IReadOnlyList<string> RequiredKeys => Definition.RequiredPrefetch;

    /// <summary>Optional usage text for discovery.</summary>
    public string? UsageRequirements { get; init; }
}
