using CdsNatremia.Core.Engine;
using CdsNatremia.Service.Configuration;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Service.Hooks;

/// <summary>
/// The services this host offers: one per hook definition in <see cref="HookDefinitions.All"/>, in that order. Built once from
/// configuration (the result hook's domain is configurable).
/// </summary>
public sealed class ServiceCatalog
{
    /// <summary>The noun-verb part of the organisation-specific result hook.</summary>
    public const string ResultHookSuffix = HookDefinitions.ResultHookSuffix;

    private readonly Dictionary<string, ServiceDefinition> _byId;

    /// <summary>Creates the catalog.</summary>
    public ServiceCatalog(IOptions<NatremiaServiceOptions> options)
    {
        ArgumentNullException.ThrowIfNull(options);
        var domain = options.Value.ResultHookDomain;
        ResultHook = HookDefinitions.ResultArrive.NameIn(domain);
        Services = HookDefinitions.All.Select(h => new ServiceDefinition { Definition = h, Hook = h.NameIn(domain) }).ToList();
        _byId = Services.ToDictionary(s => s.Id, StringComparer.Ordinal);
    }

    /// <summary>The configured result hook name, e.g. "org.example.lab-result-arrive".</summary>
    public string ResultHook { get; }

    /// <summary>All services, in discovery order.</summary>
    public IReadOnlyList<ServiceDefinition> Services { get; }

    /// <summary>The service with this id, or null.</summary>
    public ServiceDefinition? Find(string id) => _byId.GetValueOrDefault(id);
}
